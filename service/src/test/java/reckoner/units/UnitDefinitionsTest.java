package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every unit of the table against its published definition, restated here independently of the
 * table's own wording (the table defines many rows through others; here each value is written out
 * in coherent SI units). The third column names the document the value comes from; "from memory"
 * marks values taken from general knowledge rather than a document at hand.
 */
final class UnitDefinitionsTest {
  private static final UnitTable TABLE = UnitTable.standard();

  private static Arguments row(String key, String expected, String source) {
    return Arguments.of(key, expected, source);
  }

  static Stream<Arguments> publishedDefinitions() {
    return Stream.of(
        row("metre", "1", "SI Brochure 9th ed. Table 2"),
        row("kilogram", "1", "SI Brochure 9th ed. Table 2"),
        row("gram", "0.001", "SI Brochure 9th ed. Table 2, 3.2"),
        row("second", "1", "SI Brochure 9th ed. Table 2"),
        row("ampere", "1", "SI Brochure 9th ed. Table 2"),
        row("kelvin", "1", "SI Brochure 9th ed. Table 2"),
        row("mole", "1", "SI Brochure 9th ed. Table 2"),
        row("candela", "1", "SI Brochure 9th ed. Table 2"),
        row("radian", "1", "SI Brochure 9th ed. Table 4"),
        row("bit", "1", "IEC 80000-13:2008 13-9.b"),
        row("steradian", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("hertz", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("newton", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("pascal", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("joule", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("watt", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("coulomb", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("volt", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("farad", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("ohm", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("siemens", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("weber", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("tesla", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("henry", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("degC", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("lumen", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("lux", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("katal", "1", "SI Brochure 9th ed. Table 4 (coherent: factor 1)"),
        row("minute", "60", "SI Brochure 9th ed. Table 8: 1 min = 60 s"),
        row("hour", "3600", "SI Brochure 9th ed. Table 8: 1 h = 3600 s"),
        row("day", "86400", "SI Brochure 9th ed. Table 8: 1 d = 86 400 s"),
        row("astronomical_unit", "149597870700", "SI Brochure 9th ed. Table 8: 1 au = 149 597 870 700 m"),
        row("degree", "1/180 pi^1", "SI Brochure 9th ed. Table 8: 1° = (π/180) rad"),
        row("arcminute", "1/10800 pi^1", "SI Brochure 9th ed. Table 8: 1′ = (π/10 800) rad"),
        row("arcsecond", "1/648000 pi^1", "SI Brochure 9th ed. Table 8: 1″ = (π/648 000) rad"),
        row("hectare", "10000", "SI Brochure 9th ed. Table 8: 1 ha = 10^4 m^2"),
        row("litre", "0.001", "SI Brochure 9th ed. Table 8: 1 L = 10^-3 m^3"),
        row("tonne", "1000", "SI Brochure 9th ed. Table 8: 1 t = 10^3 kg"),
        row("electronvolt", "0.0000000000000000001602176634", "SI Brochure 9th ed. Table 8: 1 eV = 1.602 176 634 × 10^-19 J"),
        row("week", "604800", "SP811 B.8: week = 6.048 E+05 s"),
        row("fortnight", "1209600", "14 days (from memory)"),
        row("shake", "0.00000001", "SP811 B.8: shake = 1.0 E-08 s"),
        row("year_common", "31536000", "SP811 B.8: year (365 days) = 3.1536 E+07 s"),
        row("year_julian", "31557600", "Julian year 365.25 d (from memory)"),
        row("year_gregorian", "31556952", "Gregorian year 365.2425 d (from memory)"),
        row("month_mean", "2629746", "one twelfth of 365.2425 d (from memory)"),
        row("month_30", "2592000", "30 days (from memory)"),
        row("decade", "315569520", "10 Gregorian years (from memory)"),
        row("century", "3155695200", "100 Gregorian years (from memory)"),
        row("millennium", "31556952000", "1000 Gregorian years (from memory)"),
        row("inch", "0.0254", "1959 agreement / SP811 B.8: 1 in = 0.0254 m exactly"),
        row("foot", "0.3048", "1959 agreement / SP811 B.8: 1 ft = 0.3048 m exactly"),
        row("yard", "0.9144", "1959 agreement / SP811 B.8: 1 yd = 0.9144 m exactly"),
        row("mile", "1609.344", "SP811 B.8: mile (international) = 1.609 344 E+03 m exactly"),
        row("thou", "0.0000254", "SP811 B.8: mil = 2.54 E-05 m exactly"),
        row("hand", "0.1016", "4 in (from memory)"),
        row("fathom", "1.8288", "6 ft international"),
        row("rod", "5.0292", "16.5 ft international"),
        row("chain", "20.1168", "66 ft international"),
        row("link", "0.201168", "0.66 ft international"),
        row("furlong", "201.168", "660 ft international"),
        row("league", "4828.032", "3 international miles (from memory)"),
        row("nautical_mile", "1852", "SP811 B.8: nautical mile = 1.852 E+03 m exactly"),
        row("cable", "185.2", "1/10 nautical mile (from memory)"),
        row("foot_survey", "1200/3937", "SP811 B.6: US survey foot = 1200/3937 m"),
        row("mile_survey", "6336000/3937", "5280 survey feet"),
        row("rod_survey", "19800/3937", "16.5 survey feet"),
        row("chain_survey", "79200/3937", "66 survey feet"),
        row("link_survey", "792/3937", "0.66 survey feet"),
        row("furlong_survey", "792000/3937", "660 survey feet"),
        row("fathom_survey", "7200/3937", "6 survey feet"),
        row("angstrom", "0.0000000001", "SP811 B.8: ångström = 1.0 E-10 m"),
        row("micron", "0.000001", "SP811 B.8: micron = 1.0 E-06 m"),
        row("fermi", "0.000000000000001", "SP811 B.8: fermi = 1.0 E-15 m"),
        row("light_year", "9460730472580800", "c (SI9 Table 1) × Julian year: 9 460 730 472 580 800 m"),
        row("light_second", "299792458", "c × 1 s (SI9 Table 1)"),
        row("parsec", "96939420213600000 pi^-1", "648 000/π au (from memory)"),
        row("point", "127/360000", "CSS 1pt = 1/72 in (from memory)"),
        row("pica", "127/30000", "CSS 1pc = 1/6 in (from memory)"),
        row("pixel", "127/480000", "CSS 1px = 1/96 in (from memory)"),
        row("twip", "127/7200000", "1/1440 in (from memory)"),
        row("point_printers", "0.0003514598", "SP811 B.8: point (printer's) = 0.013 837 in"),
        row("pica_printers", "0.0042175176", "12 printer's points = 0.166 044 in"),
        row("mile_scandinavian", "10000", "10 km (from memory)"),
        row("are", "100", "SP811 B.8: are = 1.0 E+02 m^2"),
        row("acre", "4046.8564224", "43 560 ft^2 international = 4046.856 422 4 m^2"),
        row("acre_survey", "62726400000/15499969", "43 560 survey ft^2"),
        row("barn", "0.0000000000000000000000000001", "SP811 B.8: barn = 1.0 E-28 m^2"),
        row("circular_mil", "0.00000000016129 pi^1", "SP811 B.8: circular mil = (π/4) mil^2"),
        row("dunam", "1000", "1000 m^2 (from memory)"),
        row("darcy", "1/1013250000000", "1 cP·cm^2/(s·atm/cm) = 10^-12/1.013 25 m^2"),
        row("cubic_centimetre", "0.000001", "SP811 B.8: cubic centimeter = 1.0 E-06 m^3"),
        row("stere", "1", "SP811 B.8: stere = 1 m^3"),
        row("lambda", "0.000000001", "SP811 B.8: lambda = 1.0 E-09 m^3"),
        row("gal_us", "0.003785411784", "231 in^3 = 3.785 411 784 L exactly"),
        row("qt_us", "0.000946352946", "1/4 US gallon"),
        row("pt_us", "0.000473176473", "1/8 US gallon"),
        row("cup_us", "0.0002365882365", "1/16 US gallon"),
        row("gill_us", "0.00011829411825", "1/32 US gallon"),
        row("floz_us", "0.0000295735295625", "1/128 US gallon"),
        row("tbsp_us", "0.00001478676478125", "1/2 US fl oz"),
        row("tsp_us", "0.00000492892159375", "1/6 US fl oz"),
        row("fldr_us", "0.0000036966911953125", "1/8 US fl oz"),
        row("minim_us", "0.000000061611519921875", "1/480 US fl oz (from memory)"),
        row("jigger", "0.00004436029434375", "1.5 US fl oz (from memory)"),
        row("barrel_oil", "0.158987294928", "42 US gallons = 158.987 294 928 L"),
        row("barrel_beer", "0.117347765304", "31 US gallons (from memory)"),
        row("barrel_dry", "0.115627123584", "7056 in^3 (from memory)"),
        row("hogshead", "0.238480942392", "63 US gallons (from memory)"),
        row("cup_legal", "0.00024", "240 mL (from memory)"),
        row("bu_us", "0.03523907016688", "2150.42 in^3 = 35.239 070 166 88 L"),
        row("pk_us", "0.00880976754172", "1/4 US bushel"),
        row("gal_dry", "0.00440488377086", "1/8 US bushel"),
        row("qt_dry", "0.001101220942715", "1/32 US bushel"),
        row("pt_dry", "0.0005506104713575", "1/64 US bushel"),
        row("gal_imp", "0.00454609", "Weights and Measures Act 1985: 4.546 09 L"),
        row("qt_imp", "0.0011365225", "1/4 imperial gallon"),
        row("pt_imp", "0.00056826125", "1/8 imperial gallon = 568.261 25 mL"),
        row("gill_imp", "0.0001420653125", "1/32 imperial gallon"),
        row("floz_imp", "0.0000284130625", "1/160 imperial gallon = 28.413 062 5 mL"),
        row("fldr_imp", "0.0000035516328125", "1/8 imperial fl oz (from memory)"),
        row("cup_imp", "0.000284130625", "10 imperial fl oz (from memory)"),
        row("bu_imp", "0.03636872", "8 imperial gallons (from memory)"),
        row("pk_imp", "0.00909218", "2 imperial gallons (from memory)"),
        row("cup_metric", "0.00025", "250 mL (from memory)"),
        row("tbsp_metric", "0.000015", "15 mL (from memory)"),
        row("tbsp_au", "0.00002", "20 mL (from memory)"),
        row("tsp_metric", "0.000005", "5 mL (from memory)"),
        row("pint_metric", "0.0005", "500 mL (from memory)"),
        row("floz_metric", "0.00003", "30 mL (from memory)"),
        row("board_foot", "0.002359737216", "144 in^3"),
        row("cord", "3.624556363776", "128 ft^3"),
        row("acre_foot", "1233.48183754752", "international acre × foot"),
        row("acre_foot_survey", "75271680000000/61023377953", "survey acre × survey foot"),
        row("register_ton", "2.8316846592", "100 ft^3"),
        row("pound", "0.45359237", "1959 agreement / SP811 B.8: 1 lb = 0.453 592 37 kg exactly"),
        row("ounce", "0.028349523125", "1/16 lb"),
        row("grain", "0.00006479891", "1/7000 lb = 64.798 91 mg"),
        row("dram_avdp", "0.0017718451953125", "1/16 oz"),
        row("stone", "6.35029318", "14 lb"),
        row("cwt_short", "45.359237", "100 lb"),
        row("cwt_long", "50.80234544", "112 lb"),
        row("ton_short", "907.18474", "2000 lb"),
        row("ton_long", "1016.0469088", "2240 lb"),
        row("ounce_troy", "0.0311034768", "480 grains = 31.103 476 8 g"),
        row("pound_troy", "0.3732417216", "12 troy ounces"),
        row("pennyweight", "0.00155517384", "24 grains"),
        row("dram_ap", "0.0038879346", "60 grains"),
        row("scruple", "0.0012959782", "20 grains (from memory)"),
        row("carat", "0.0002", "SP811 B.8: carat (metric) = 2.0 E-04 kg"),
        row("microgram_mcg", "0.000000001", "1 µg"),
        row("quintal", "100", "100 kg (from memory)"),
        row("kph", "5/18", "1000 m / 3600 s"),
        row("mph", "0.44704", "SP811 B.8: mile per hour = 4.4704 E-01 m/s exactly"),
        row("knot", "463/900", "1852 m / 3600 s"),
        row("fps", "0.3048", "1 ft/s"),
        row("fpm", "0.00508", "1 ft/min"),
        row("ips", "0.0254", "1 in/s"),
        row("speed_of_light", "299792458", "SI9 Table 1: c = 299 792 458 m/s"),
        row("gal_accel", "0.01", "SP811 B.8: gal = 1.0 E-02 m/s^2"),
        row("standard_gravity", "9.80665", "SP811 B.8: standard acceleration of free fall = 9.806 65 m/s^2 (3rd CGPM 1901)"),
        row("dyne", "0.00001", "SP811 B.8: dyne = 1.0 E-05 N"),
        row("kilogram_force", "9.80665", "SP811 B.8: kilogram-force = 9.806 65 N exactly"),
        row("gram_force", "0.00980665", "kgf/1000"),
        row("tonne_force", "9806.65", "kgf × 1000"),
        row("pound_force", "4.4482216152605", "lb × g_n = 4.448 221 615 260 5 N"),
        row("ounce_force", "0.27801385095378125", "lbf/16"),
        row("poundal", "0.138254954376", "lb·ft/s^2 = 0.138 254 954 376 N"),
        row("slug", "8896443230521/609600000000", "lbf·s^2/ft"),
        row("kip", "4448.2216152605", "1000 lbf"),
        row("ton_force", "8896.443230521", "2000 lbf"),
        row("bar", "100000", "SP811 B.8: bar = 1.0 E+05 Pa"),
        row("atmosphere", "101325", "SP811 B.8: standard atmosphere = 101 325 Pa exactly (10th CGPM 1954)"),
        row("atmosphere_technical", "98066.5", "SP811 B.8: technical atmosphere = 9.806 65 E+04 Pa exactly"),
        row("torr", "20265/152", "1/760 atm"),
        row("mmHg", "133.322387415", "13.5951 g/cm^3 × g_n × 1 mm = 133.322 387 415 Pa"),
        row("cmHg", "1333.22387415", "10 mmHg"),
        row("inHg", "3386.388640341", "13.5951 g/cm^3 × g_n × 1 in"),
        row("mmH2O", "9.80665", "1000 kg/m^3 × g_n × 1 mm = 9.806 65 Pa"),
        row("cmH2O", "98.0665", "10 mmH2O"),
        row("mH2O", "9806.65", "1000 mmH2O"),
        row("inH2O", "249.08891", "1000 kg/m^3 × g_n × 1 in = 249.088 91 Pa"),
        row("ftH2O", "2989.06692", "1000 kg/m^3 × g_n × 1 ft"),
        row("psi", "8896443230521/1290320000", "lbf/in^2"),
        row("ksi", "8896443230521/1290320", "kip/in^2"),
        row("psf", "8896443230521/185806080000", "lbf/ft^2"),
        row("barye", "0.1", "SP811 B.8: dyne per square centimeter = 0.1 Pa"),
        row("erg", "0.0000001", "SP811 B.8: erg = 1.0 E-07 J"),
        row("cal_th", "4.184", "SP811 B.8: calorie (thermochemical) = 4.184 J exactly"),
        row("cal_IT", "4.1868", "SP811 B.8: calorie (IT) = 4.1868 J exactly"),
        row("Btu_IT", "1055.05585262", "cal_IT/(g·°C) × lb × °F = 1055.055 852 62 J"),
        row("Btu_th", "23722880951/22500000", "cal_th/(g·°C) × lb × °F"),
        row("Btu_59F", "1054.804", "SP811 B.8: Btu (59 °F) = 1054.804 J"),
        row("therm_EC", "105505585.262", "100 000 Btu_IT"),
        row("therm_US", "105480400", "100 000 Btu_59F"),
        row("watt_hour", "3600", "SP811 B.8: watt hour = 3.6 E+03 J exactly"),
        row("foot_pound", "1.3558179483314004", "ft × lbf"),
        row("foot_poundal", "0.0421401100938048", "ft × poundal"),
        row("ton_tnt", "4184000000", "SP811 B.8: ton of TNT = 4.184 E+09 J exactly"),
        row("toe", "41868000000", "10^7 kcal_IT = 41.868 GJ (from memory)"),
        row("newton_metre", "1", "SI Brochure 9th ed. Table 6: N m"),
        row("pound_foot", "1.3558179483314004", "lbf × ft"),
        row("pound_inch", "0.1129848290276167", "lbf × in"),
        row("ounce_inch", "0.00706155181422604375", "ozf × in"),
        row("kgf_metre", "9.80665", "kgf × m"),
        row("hp_mech", "745.69987158227022", "550 ft·lbf/s = 745.699 871 582 270 22 W"),
        row("hp_metric", "735.49875", "75 kgf·m/s = 735.498 75 W"),
        row("hp_elec", "746", "SP811 B.8: horsepower (electric) = 746 W exactly"),
        row("ton_refrigeration", "52752792631/15000000", "12 000 Btu_IT/h"),
        row("volt_ampere", "1", "V × A (from memory)"),
        row("degF", "5/9", "SP811 B.9: T/K = (t/°F + 459.67)/1.8"),
        row("degR", "5/9", "SP811 B.9: T/K = (T/°R)/1.8"),
        row("delta_degC", "1", "SP811 B.9: 1 °C interval = 1 K"),
        row("delta_degF", "5/9", "SP811 B.9: 1 °F interval = 5/9 K"),
        row("gon", "0.005 pi^1", "SP811 B.8: gon = π/200 rad"),
        row("revolution", "2 pi^1", "2π rad"),
        row("mil_angular", "0.0003125 pi^1", "2π/6400 rad"),
        row("square_degree", "1/32400 pi^2", "(π/180)^2 sr"),
        row("spat", "4 pi^1", "4π sr (from memory)"),
        row("rpm", "1/30 pi^1", "2π rad / 60 s"),
        row("rps", "2 pi^1", "2π rad/s"),
        row("byte", "8", "IEC 80000-13:2008 13-9.c: 1 B = 8 bit"),
        row("octet", "8", "IEC 80000-13:2008: 1 o = 8 bit"),
        row("nibble", "4", "4 bit (from memory)"),
        row("bit_per_second", "1", "bit/s"),
        row("ampere_hour", "3600", "SP811 B.8: ampere hour = 3.6 E+03 C exactly"),
        row("gauss", "0.0001", "SP811 B.8: gauss = 1.0 E-04 T"),
        row("maxwell", "0.00000001", "SP811 B.8: maxwell = 1.0 E-08 Wb"),
        row("oersted", "250 pi^-1", "SP811 B.8: oersted = (1000/4π) A/m"),
        row("gamma", "0.000000001", "SP811 B.8: gamma = 1.0 E-09 T"),
        row("phot", "10000", "SP811 B.8: phot = 1.0 E+04 lx"),
        row("footcandle", "1562500/145161", "lm/ft^2"),
        row("nit", "1", "cd/m^2 (from memory)"),
        row("stilb", "10000", "SP811 B.8: stilb = 1.0 E+04 cd/m^2"),
        row("lambert", "10000 pi^-1", "SP811 B.8: lambert = (10^4/π) cd/m^2"),
        row("footlambert", "1562500/145161 pi^-1", "SP811 B.8: footlambert = (1/π) cd/ft^2"),
        row("poise", "0.1", "SP811 B.8: poise = 0.1 Pa·s"),
        row("stokes", "0.0001", "SP811 B.8: stokes = 1.0 E-04 m^2/s"),
        row("tex", "0.000001", "SP811 B.8: tex = 1.0 E-06 kg/m"),
        row("denier", "1/9000000", "SP811 B.8: denier = 1 g / 9000 m"),
        row("langley", "41840", "SP811 B.8: langley = 4.184 E+04 J/m^2"),
        row("clo", "0.155", "SP811 B.8: clo = 0.155 m^2·K/W"),
        row("kayser", "100", "1 cm^-1 (from memory)"),
        row("dioptre", "1", "1 m^-1 (from memory)"),
        row("molar", "1000", "1 mol/dm^3 (IUPAC Green Book, from memory)"),
        row("pound_mole", "453.59237", "453.592 37 mol (from memory)"),
        row("ratio", "1", "1"),
        row("percent", "0.01", "% = 0.01"),
        row("permille", "0.001", "‰ = 0.001"),
        row("permyriad", "0.0001", "‱ = 0.0001"),
        row("basis_point", "0.0001", "0.01 % (from memory)"),
        row("ppm", "0.000001", "10^-6"),
        row("ppb", "0.000000001", "10^-9"),
        row("ppt_trillion", "0.000000000001", "10^-12"),
        row("karat", "1/24", "1/24 (from memory)"),
        row("mpg", "48000000000/112903", "mile per US gallon"),
        row("mpg_imp", "160934400000/454609", "mile per imperial gallon"),
        row("gpm", "0.0000630901964", "US gallon per minute"),
        row("cfm", "0.0004719474432", "ft^3/min"),
        row("cfs", "0.028316846592", "ft^3/s"),
        row("lpm", "1/60000", "L/min"),
        row("mgd", "157725491/3600000000", "10^6 US gallons per day"),
        row("end", "", ""))
        .filter(a -> !a.get()[0].equals("end"));
  }

  @ParameterizedTest(name = "{0} = {1} ({2})")
  @MethodSource("publishedDefinitions")
  void row_factor_equalsPublishedValue(String key, String expected, String source) {
    UnitDef def = TABLE.byKey(key).orElseThrow(() -> new AssertionError("no row " + key));
    assertEquals(parse(expected), def.factor(), () -> key + " per " + source + "; the table says " + def.definition());
  }

  @Test
  void everyUnambiguousRow_isCheckedAgainstAPublishedValue() {
    Set<String> checked = publishedDefinitions().map(a -> (String) a.get()[0]).collect(Collectors.toCollection(TreeSet::new));
    Set<String> rows = TABLE.rows().stream().filter(d -> !d.isAmbiguous()).map(UnitDef::key)
        .collect(Collectors.toCollection(TreeSet::new));
    assertEquals(rows, checked);
  }

  @Test
  void table_hasAtLeast250UnitsBeforePrefixes() {
    long units = TABLE.rows().stream().filter(d -> !d.isAmbiguous()).count();
    assertTrue(units >= 250, "units: " + units);
  }

  // ---- the temperature scales' offsets ----

  @Test
  void celsius_offsetIs273point15() {
    // SI Brochure 9th ed., 2.3.1 and Table 4: t/°C = T/K - 273.15
    assertEquals(Rational.parse("273.15"), TABLE.byKey("degC").orElseThrow().offset());
  }

  @Test
  void fahrenheit_offsetIs459point67() {
    // NIST SP 811 (2008) B.9, temperature: T/K = (t/°F + 459.67)/1.8
    assertEquals(Rational.parse("459.67"), TABLE.byKey("degF").orElseThrow().offset());
  }

  @Test
  void onlyCelsiusAndFahrenheit_haveOffsets() {
    List<String> withOffset = TABLE.rows().stream().filter(UnitDef::hasOffset).map(UnitDef::key).toList();
    assertEquals(List.of("degC", "degF"), withOffset);
  }

  @Test
  void differenceUnits_areIntervalsWithoutOffset() {
    for (String key : List.of("delta_degC", "delta_degF")) {
      UnitDef d = TABLE.byKey(key).orElseThrow();
      assertTrue(d.interval(), key);
      assertFalse(d.hasOffset(), key);
    }
  }

  // ---- every row names its source ----

  @Test
  void everyRow_namesItsSource() {
    TABLE.rows().forEach(d -> assertFalse(d.source().isBlank(), d.key()));
  }

  /** {@code 0.0254}, {@code 1200/3937}, {@code 1/180 pi^1}. */
  static Factor parse(String expected) {
    String[] parts = expected.split(" pi\\^");
    int pi = parts.length > 1 ? Integer.parseInt(parts[1]) : 0;
    return new Factor(Rational.parse(parts[0]), pi);
  }
}
