package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.tool.ToolException;

/**
 * Conversions checked against the factor tables of NIST Special Publication 811 (2008 edition),
 * Appendix B.8 ("Factors for units listed alphabetically") and B.9 ("by kind of quantity"): one
 * unit of the entry named in the first column is converted and rounded, half-even, to as many
 * significant digits as the table prints, and must equal the printed factor ("4.046 873 E+03").
 * The printed factors here are quoted from memory of the 2008 edition, not from a copy at hand;
 * each was also checked against the exact defining relation before being written down.
 *
 * <p>Where SP 811 (2008) lists a unit based on the U.S. survey foot (acre, rod, chain), the
 * survey row (acre_survey, rd_us, ch_us) is checked; the table's default acre and rod are
 * international. The electronvolt is not checked here: SP 811 (2008) prints the CODATA 2006
 * value, superseded by the exact 2019 value (see {@link UnitDefinitionsTest}).
 */
final class NistFactorsTest {
  private static final UnitTable TABLE = UnitTable.standard();

  private static Arguments nist(String entry, String from, String to, String printed) {
    return Arguments.of(entry, from, to, printed);
  }

  static Stream<Arguments> appendixB() {
    return Stream.of(
        nist("acre (based on U.S. survey foot)", "acre_survey", "m^2", "4.046 873 E+03"),
        nist("acre-foot (based on U.S. survey foot)", "ac_ft_us", "m^3", "1.233 489 E+03"),
        nist("ampere hour", "A h", "C", "3.6 E+03"),
        nist("ångström", "Å", "m", "1.0 E-10"),
        nist("ångström", "Å", "nm", "1.0 E-01"),
        nist("are", "are", "m^2", "1.0 E+02"),
        nist("astronomical unit", "au", "m", "1.495 979 E+11"),
        nist("atmosphere, standard", "atm", "Pa", "1.013 25 E+05"),
        nist("atmosphere, standard", "atm", "kPa", "1.013 25 E+02"),
        nist("atmosphere, technical", "at", "Pa", "9.806 65 E+04"),
        nist("bar", "bar", "Pa", "1.0 E+05"),
        nist("barn", "barn", "m^2", "1.0 E-28"),
        nist("barrel [for petroleum, 42 gallons (U.S.)]", "bbl", "m^3", "1.589 873 E-01"),
        nist("barrel [for petroleum, 42 gallons (U.S.)]", "bbl", "L", "1.589 873 E+02"),
        nist("board foot", "board foot", "m^3", "2.359 737 E-03"),
        nist("British thermal unit_IT", "Btu_IT", "J", "1.055 056 E+03"),
        nist("British thermal unit_th", "Btu_th", "J", "1.054 350 E+03"),
        nist("British thermal unit (59 °F)", "Btu_59F", "J", "1.054 804 E+03"),
        nist("British thermal unit_IT per hour", "Btu_IT/h", "W", "2.930 711 E-01"),
        nist("British thermal unit_th per hour", "Btu_th/h", "W", "2.928 751 E-01"),
        nist("British thermal unit_IT per pound", "Btu_IT/lb", "J/kg", "2.326 E+03"),
        nist("British thermal unit_IT per pound degree Fahrenheit", "Btu_IT/(lb Δ°F)", "J/(kg K)", "4.1868 E+03"),
        nist("British thermal unit_IT per cubic foot", "Btu_IT/ft^3", "J/m^3", "3.725 895 E+04"),
        nist("bushel (U.S.)", "bu_us", "m^3", "3.523 907 E-02"),
        nist("calorie_IT", "cal_IT", "J", "4.1868 E+00"),
        nist("calorie_th", "cal_th", "J", "4.184 E+00"),
        nist("calorie_th per gram degree Celsius", "cal_th/(g Δ°C)", "J/(kg K)", "4.184 E+03"),
        nist("calorie_th per second", "cal_th/s", "W", "4.184 E+00"),
        nist("carat, metric", "ct", "kg", "2.0 E-04"),
        nist("centimeter of mercury, conventional", "cmHg", "Pa", "1.333 224 E+03"),
        nist("centipoise", "cP", "Pa s", "1.0 E-03"),
        nist("centistokes", "cSt", "m^2/s", "1.0 E-06"),
        nist("chain (based on U.S. survey foot)", "ch_us", "m", "2.011 684 E+01"),
        nist("circular mil", "cmil", "m^2", "5.067 075 E-10"),
        nist("clo", "clo", "m^2 K/W", "1.55 E-01"),
        nist("cord (128 ft^3)", "cord", "m^3", "3.624 556 E+00"),
        nist("cubic foot", "ft^3", "m^3", "2.831 685 E-02"),
        nist("cubic foot per minute", "cfm", "m^3/s", "4.719 474 E-04"),
        nist("cubic foot per minute", "ft^3/min", "L/s", "4.719 474 E-01"),
        nist("cubic foot per second", "ft^3/s", "m^3/s", "2.831 685 E-02"),
        nist("cubic inch", "in^3", "m^3", "1.638 706 E-05"),
        nist("cubic inch per minute", "in^3/min", "m^3/s", "2.731 177 E-07"),
        nist("cubic mile", "mi^3", "m^3", "4.168 182 E+09"),
        nist("cubic yard", "yd^3", "m^3", "7.645 549 E-01"),
        nist("cubic yard per minute", "yd^3/min", "m^3/s", "1.274 258 E-02"),
        nist("cup (U.S.)", "cup_us", "m^3", "2.365 882 E-04"),
        nist("darcy", "darcy", "m^2", "9.869 233 E-13"),
        nist("day", "d", "s", "8.64 E+04"),
        nist("degree (angle)", "°", "rad", "1.745 329 E-02"),
        nist("degree Fahrenheit hour per British thermal unit_IT", "Δ°F h/Btu_IT", "K/W", "1.895 634 E+00"),
        nist("denier", "denier", "kg/m", "1.111 111 E-07"),
        nist("dram (avoirdupois)", "dr_avdp", "kg", "1.771 845 E-03"),
        nist("dram (troy or apothecary)", "dr_ap", "kg", "3.887 935 E-03"),
        nist("dram (U.S. fluid)", "fldr", "m^3", "3.696 691 E-06"),
        nist("dyne", "dyn", "N", "1.0 E-05"),
        nist("dyne centimeter", "dyn cm", "N m", "1.0 E-07"),
        nist("dyne per square centimeter", "dyn/cm^2", "Pa", "1.0 E-01"),
        nist("erg", "erg", "J", "1.0 E-07"),
        nist("erg per second", "erg/s", "W", "1.0 E-07"),
        nist("fathom (based on U.S. survey foot)", "ftm_us", "m", "1.828 804 E+00"),
        nist("fermi", "fermi", "m", "1.0 E-15"),
        nist("fluid ounce (U.S.)", "floz_us", "m^3", "2.957 353 E-05"),
        nist("foot", "ft", "m", "3.048 E-01"),
        nist("foot (U.S. survey)", "ft_us", "m", "3.048 006 E-01"),
        nist("foot of water, conventional", "ftH2O", "Pa", "2.989 067 E+03"),
        nist("foot per hour", "ft/h", "m/s", "8.466 667 E-05"),
        nist("foot per minute", "ft/min", "m/s", "5.08 E-03"),
        nist("foot per second", "ft/s", "m/s", "3.048 E-01"),
        nist("foot per second squared", "ft/s^2", "m/s^2", "3.048 E-01"),
        nist("footcandle", "fc", "lx", "1.076 391 E+01"),
        nist("footlambert", "footlambert", "cd/m^2", "3.426 259 E+00"),
        nist("foot pound-force", "ft lbf", "J", "1.355 818 E+00"),
        nist("foot pound-force per hour", "ft lbf/h", "W", "3.766 161 E-04"),
        nist("foot pound-force per minute", "ft lbf/min", "W", "2.259 697 E-02"),
        nist("foot pound-force per second", "ft lbf/s", "W", "1.355 818 E+00"),
        nist("foot poundal", "ft pdl", "J", "4.214 011 E-02"),
        nist("furlong (based on U.S. survey foot)", "fur_us", "m", "2.011 684 E+02"),
        nist("gal", "Gal", "m/s^2", "1.0 E-02"),
        nist("gallon [Canadian and U.K. (Imperial)]", "gal_imp", "m^3", "4.546 09 E-03"),
        nist("gallon (U.S.)", "gal_us", "m^3", "3.785 412 E-03"),
        nist("gallon (U.S.)", "gal_us", "L", "3.785 412 E+00"),
        nist("gallon (U.S.) per day", "gal_us/d", "m^3/s", "4.381 264 E-08"),
        nist("gallon (U.S.) per minute", "gpm", "m^3/s", "6.309 020 E-05"),
        nist("gallon (U.S.) per minute", "gal_us/min", "L/s", "6.309 020 E-02"),
        nist("gallon (U.S.) per horsepower hour", "gal_us/(hp_mech h)", "m^3/J", "1.410 089 E-09"),
        nist("gamma", "gamma", "T", "1.0 E-09"),
        nist("gauss", "G", "T", "1.0 E-04"),
        nist("gill [Canadian and U.K. (Imperial)]", "gill_imp", "m^3", "1.420 653 E-04"),
        nist("gill (U.S.)", "gill_us", "m^3", "1.182 941 E-04"),
        nist("gon", "gon", "rad", "1.570 796 E-02"),
        nist("gon", "gon", "°", "9.0 E-01"),
        nist("grain", "gr", "kg", "6.479 891 E-05"),
        nist("grain per gallon (U.S.)", "gr/gal_us", "kg/m^3", "1.711 806 E-02"),
        nist("gram per cubic centimeter", "g/cm^3", "kg/m^3", "1.0 E+03"),
        nist("hectare", "ha", "m^2", "1.0 E+04"),
        nist("horsepower (550 ft lbf/s)", "hp_mech", "W", "7.456 999 E+02"),
        nist("horsepower (electric)", "hp_elec", "W", "7.46 E+02"),
        nist("horsepower (metric)", "hp_metric", "W", "7.354 988 E+02"),
        nist("hour", "h", "s", "3.6 E+03"),
        nist("hundredweight (long, 112 lb)", "cwt_long", "kg", "5.080 235 E+01"),
        nist("hundredweight (short, 100 lb)", "cwt_short", "kg", "4.535 924 E+01"),
        nist("inch", "in", "m", "2.54 E-02"),
        nist("inch of mercury, conventional", "inHg", "Pa", "3.386 389 E+03"),
        nist("inch of water, conventional", "inH2O", "Pa", "2.490 889 E+02"),
        nist("inch per second", "in/s", "m/s", "2.54 E-02"),
        nist("inch per second squared", "in/s^2", "m/s^2", "2.54 E-02"),
        nist("kilocalorie_IT", "kcal_IT", "J", "4.1868 E+03"),
        nist("kilocalorie_th", "kcal_th", "J", "4.184 E+03"),
        nist("kilocalorie_th per minute", "kcal_th/min", "W", "6.973 333 E+01"),
        nist("kilocalorie_th per second", "kcal_th/s", "W", "4.184 E+03"),
        nist("kilogram-force", "kgf", "N", "9.806 65 E+00"),
        nist("kilogram-force meter", "kgf m", "N m", "9.806 65 E+00"),
        nist("kilogram-force per square centimeter", "kgf/cm^2", "Pa", "9.806 65 E+04"),
        nist("kilogram-force per square meter", "kgf/m^2", "Pa", "9.806 65 E+00"),
        nist("kilogram-force per square millimeter", "kgf/mm^2", "Pa", "9.806 65 E+06"),
        nist("kilogram-force second squared per meter", "kgf s^2/m", "kg", "9.806 65 E+00"),
        nist("kilometer per hour", "km/h", "m/s", "2.777 778 E-01"),
        nist("kilopond", "kp", "N", "9.806 65 E+00"),
        nist("kilowatt hour", "kWh", "J", "3.6 E+06"),
        nist("kilowatt hour", "kW h", "MJ", "3.6 E+00"),
        nist("kip (1 kip = 1000 lbf)", "kip", "N", "4.448 222 E+03"),
        nist("kip per square inch", "ksi", "Pa", "6.894 757 E+06"),
        nist("knot (nautical mile per hour)", "kn", "m/s", "5.144 444 E-01"),
        nist("lambert", "lambert", "cd/m^2", "3.183 099 E+03"),
        nist("langley", "langley", "J/m^2", "4.184 E+04"),
        nist("light year", "ly", "m", "9.460 73 E+15"),
        nist("liter", "L", "m^3", "1.0 E-03"),
        nist("maxwell", "Mx", "Wb", "1.0 E-08"),
        nist("mho", "mho", "S", "1.0 E+00"),
        nist("microinch", "0.000001 in", "m", "2.54 E-08"),
        nist("micron", "micron", "m", "1.0 E-06"),
        nist("mil (0.001 in)", "thou", "m", "2.54 E-05"),
        nist("mil (angle)", "mil_nato", "rad", "9.817 477 E-04"),
        nist("mil (angle)", "mil_nato", "°", "5.625 E-02"),
        nist("mile (international)", "mi", "m", "1.609 344 E+03"),
        nist("mile (based on U.S. survey foot)", "mi_us", "m", "1.609 347 E+03"),
        nist("mile, nautical", "nmi", "m", "1.852 E+03"),
        nist("mile per gallon (U.S.)", "mpg", "m^-2", "4.251 437 E+05"),
        nist("mile per gallon (U.S.)", "mi/gal_us", "km/L", "4.251 437 E-01"),
        nist("mile per hour", "mph", "m/s", "4.4704 E-01"),
        nist("mile per hour", "mi/h", "km/h", "1.609 344 E+00"),
        nist("mile per minute", "mi/min", "m/s", "2.682 24 E+01"),
        nist("mile per second", "mi/s", "m/s", "1.609 344 E+03"),
        nist("millibar", "mbar", "Pa", "1.0 E+02"),
        nist("millimeter of mercury, conventional", "mmHg", "Pa", "1.333 224 E+02"),
        nist("millimeter of water, conventional", "mmH2O", "Pa", "9.806 65 E+00"),
        nist("minute (angle)", "arcmin", "rad", "2.908 882 E-04"),
        nist("minute", "min", "s", "6.0 E+01"),
        nist("oersted", "Oe", "A/m", "7.957 747 E+01"),
        nist("ounce (avoirdupois)", "oz", "kg", "2.834 952 E-02"),
        nist("ounce (avoirdupois)", "oz", "g", "2.834 952 E+01"),
        nist("ounce (troy or apothecary)", "ozt", "kg", "3.110 348 E-02"),
        nist("ounce (troy or apothecary)", "ozt", "g", "3.110 348 E+01"),
        nist("ounce [Canadian and U.K. fluid (Imperial)]", "floz_imp", "m^3", "2.841 306 E-05"),
        nist("ounce (U.S. fluid)", "floz_us", "mL", "2.957 353 E+01"),
        nist("ounce (avoirdupois)-force", "ozf", "N", "2.780 139 E-01"),
        nist("ounce (avoirdupois)-force inch", "ozf in", "N m", "7.061 552 E-03"),
        nist("ounce (avoirdupois) per square foot", "oz/ft^2", "kg/m^2", "3.051 517 E-01"),
        nist("ounce (avoirdupois) per square yard", "oz/yd^2", "kg/m^2", "3.390 575 E-02"),
        nist("ounce (avoirdupois) per cubic inch", "oz/in^3", "kg/m^3", "1.729 994 E+03"),
        nist("parsec", "pc", "m", "3.085 678 E+16"),
        nist("peck (U.S.)", "pk_us", "m^3", "8.809 768 E-03"),
        nist("pennyweight", "dwt", "kg", "1.555 174 E-03"),
        nist("phot", "ph", "lx", "1.0 E+04"),
        nist("pica (printer's)", "pica_printer", "m", "4.217 518 E-03"),
        nist("pint (U.S. dry)", "pt_dry", "m^3", "5.506 105 E-04"),
        nist("pint (U.S. liquid)", "pt_us", "m^3", "4.731 765 E-04"),
        nist("point (printer's)", "pt_printer", "m", "3.514 598 E-04"),
        nist("poise", "P", "Pa s", "1.0 E-01"),
        nist("pound (avoirdupois)", "lb", "kg", "4.535 924 E-01"),
        nist("pound (troy or apothecary)", "lb_t", "kg", "3.732 417 E-01"),
        nist("pound foot squared", "lb ft^2", "kg m^2", "4.214 011 E-02"),
        nist("pound inch squared", "lb in^2", "kg m^2", "2.926 397 E-04"),
        nist("pound per cubic foot", "lb/ft^3", "kg/m^3", "1.601 846 E+01"),
        nist("pound per cubic inch", "lb/in^3", "kg/m^3", "2.767 990 E+04"),
        nist("pound per cubic yard", "lb/yd^3", "kg/m^3", "5.932 764 E-01"),
        nist("pound per foot", "lb/ft", "kg/m", "1.488 164 E+00"),
        nist("pound per gallon (U.S.)", "lb/gal_us", "kg/m^3", "1.198 264 E+02"),
        nist("pound per gallon [Canadian and U.K. (Imperial)]", "lb/gal_imp", "kg/m^3", "9.977 637 E+01"),
        nist("pound per hour", "lb/h", "kg/s", "1.259 979 E-04"),
        nist("pound per inch", "lb/in", "kg/m", "1.785 797 E+01"),
        nist("pound per minute", "lb/min", "kg/s", "7.559 873 E-03"),
        nist("pound per second", "lb/s", "kg/s", "4.535 924 E-01"),
        nist("pound per square foot", "lb/ft^2", "kg/m^2", "4.882 428 E+00"),
        nist("pound per square inch (not pound-force)", "lb/in^2", "kg/m^2", "7.030 696 E+02"),
        nist("pound per yard", "lb/yd", "kg/m", "4.960 546 E-01"),
        nist("pound-force", "lbf", "N", "4.448 222 E+00"),
        nist("pound-force foot", "lbf ft", "N m", "1.355 818 E+00"),
        nist("pound-force inch", "lbf in", "N m", "1.129 848 E-01"),
        nist("pound-force per foot", "lbf/ft", "N/m", "1.459 390 E+01"),
        nist("pound-force per inch", "lbf/in", "N/m", "1.751 268 E+02"),
        nist("pound-force per pound", "lbf/lb", "N/kg", "9.806 65 E+00"),
        nist("pound-force per square foot", "psf", "Pa", "4.788 026 E+01"),
        nist("pound-force per square inch", "psi", "Pa", "6.894 757 E+03"),
        nist("pound-force per square inch", "psi", "kPa", "6.894 757 E+00"),
        nist("pound-force second per square foot", "lbf s/ft^2", "Pa s", "4.788 026 E+01"),
        nist("pound-force second per square inch", "lbf s/in^2", "Pa s", "6.894 757 E+03"),
        nist("poundal", "pdl", "N", "1.382 550 E-01"),
        nist("poundal per square foot", "pdl/ft^2", "Pa", "1.488 164 E+00"),
        nist("quart (U.S. dry)", "qt_dry", "m^3", "1.101 221 E-03"),
        nist("quart (U.S. liquid)", "qt_us", "m^3", "9.463 529 E-04"),
        nist("revolution", "rev", "rad", "6.283 185 E+00"),
        nist("revolution per minute", "rpm", "rad/s", "1.047 198 E-01"),
        nist("rod (based on U.S. survey foot)", "rd_us", "m", "5.029 210 E+00"),
        nist("second (angle)", "arcsec", "rad", "4.848 137 E-06"),
        nist("shake", "shake", "s", "1.0 E-08"),
        nist("slug", "slug", "kg", "1.459 390 E+01"),
        nist("slug per cubic foot", "slug/ft^3", "kg/m^3", "5.153 788 E+02"),
        nist("slug per foot second", "slug/(ft s)", "Pa s", "4.788 026 E+01"),
        nist("square foot", "ft^2", "m^2", "9.290 304 E-02"),
        nist("square foot per hour", "ft^2/h", "m^2/s", "2.580 64 E-05"),
        nist("square foot per second", "ft^2/s", "m^2/s", "9.290 304 E-02"),
        nist("square inch", "in^2", "m^2", "6.4516 E-04"),
        nist("square mile", "mi^2", "m^2", "2.589 988 E+06"),
        nist("square mile (based on U.S. survey foot)", "mi_us^2", "m^2", "2.589 998 E+06"),
        nist("square yard", "yd^2", "m^2", "8.361 274 E-01"),
        nist("stere", "stere", "m^3", "1.0 E+00"),
        nist("stilb", "sb", "cd/m^2", "1.0 E+04"),
        nist("stokes", "St", "m^2/s", "1.0 E-04"),
        nist("tablespoon", "tbsp_us", "m^3", "1.478 676 E-05"),
        nist("teaspoon", "tsp_us", "m^3", "4.928 922 E-06"),
        nist("tex", "tex", "kg/m", "1.0 E-06"),
        nist("therm (EC)", "thm_EC", "J", "1.055 06 E+08"),
        nist("therm (U.S.)", "thm_US", "J", "1.054 804 E+08"),
        nist("ton-force (2000 lbf)", "tonf", "N", "8.896 443 E+03"),
        nist("ton, long (2240 lb)", "ton_long", "kg", "1.016 047 E+03"),
        nist("ton, short (2000 lb)", "ton_short", "kg", "9.071 847 E+02"),
        nist("ton, metric", "t", "kg", "1.0 E+03"),
        nist("ton, long, per cubic yard", "ton_long/yd^3", "kg/m^3", "1.328 939 E+03"),
        nist("ton, short, per cubic yard", "ton_short/yd^3", "kg/m^3", "1.186 553 E+03"),
        nist("ton, short, per hour", "ton_short/h", "kg/s", "2.519 958 E-01"),
        nist("ton of refrigeration (12 000 Btu_IT/h)", "TR", "W", "3.516 853 E+03"),
        nist("ton of TNT (energy equivalent)", "tTNT", "J", "4.184 E+09"),
        nist("ton, register", "RT", "m^3", "2.831 685 E+00"),
        nist("torr (Torr)", "Torr", "Pa", "1.333 224 E+02"),
        nist("watt hour", "W h", "J", "3.6 E+03"),
        nist("watt second", "W s", "J", "1.0 E+00"),
        nist("yard", "yd", "m", "9.144 E-01"),
        nist("year (365 days)", "yr_365", "s", "3.1536 E+07"),
        nist("end", "", "", ""))
        .filter(a -> !a.get()[0].equals("end"));
  }

  @ParameterizedTest(name = "SP 811 B.8/B.9 {0}: 1 {1} = {3} {2}")
  @MethodSource("appendixB")
  void conversion_matchesPrintedFactor(String entry, String from, String to, String printed) throws ToolException {
    String[] parts = printed.split(" E");
    BigDecimal expected = new BigDecimal(parts[0].replace(" ", "") + "E" + parts[1]);
    int digits = parts[0].replace(" ", "").replace(".", "").replaceFirst("^0+", "").length();
    Factor exact = Converter.convert(Rational.ONE, UnitParser.parse(from, TABLE), from, UnitParser.parse(to, TABLE), to);
    BigDecimal rounded = Rounder.toDigits(exact, digits, RoundingMode.HALF_EVEN);
    assertEquals(0, expected.compareTo(rounded), () -> entry + ": expected " + printed + " but was " + rounded);
  }

  @Test
  void atLeastOneHundredEntries_areChecked() {
    assertTrue(appendixB().count() >= 100);
  }

  // ---- B.9, fuel economy and temperature (from memory) ----

  @Test
  void milesPerGallon_toLitresPer100Kilometres_is235point215DividedByMpg() throws ToolException {
    // SP 811 (2008) B.9, fuel economy: L/(100 km) = 235.215 / (mi/gal (U.S.)), six digits printed.
    Factor exact = Converter.convert(Rational.ONE, UnitParser.parse("mpg", TABLE), "mpg",
        UnitParser.parse("L/100km", TABLE), "L/100km");
    assertEquals(new BigDecimal("235.215"), Rounder.toDigits(exact, 6, RoundingMode.HALF_EVEN));
  }

  @Test
  void fahrenheit_followsTheFormulaOfB9() throws ToolException {
    // SP 811 (2008) B.9, temperature: t/°C = (t/°F - 32)/1.8 and T/K = (t/°F + 459.67)/1.8.
    Unit f = UnitParser.parse("°F", TABLE);
    Unit c = UnitParser.parse("°C", TABLE);
    Unit k = UnitParser.parse("K", TABLE);
    assertEquals(Factor.of(Rational.of(100)), Converter.convert(Rational.of(212), f, "°F", c, "°C"));
    assertEquals(Factor.of(Rational.ZERO), Converter.convert(Rational.of(32), f, "°F", c, "°C"));
    assertEquals(Factor.of(Rational.parse("459.67").divide(Rational.parse("1.8"))),
        Converter.convert(Rational.ZERO, f, "°F", k, "K"));
  }
}
