package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import static org.quicktheories.QuickTheory.qt;

import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.tool.ToolException;

/**
 * Round trips: a value with at most {@code d} significant digits, converted from a to b (rounded
 * to 34 digits, the most a caller can ask for) and back from b to a at {@code d} digits, is the
 * value again. Every ordered pair of compatible units in a sampled set of more than 5,000 pairs is
 * tried (exhaustively), and random pairs, values and digit counts on top.
 */
final class UnitsRoundTripPropertiesTest {
  private static final UnitTable TABLE = UnitTable.standard();
  private static final Map<String, Unit> PARSED = new HashMap<>();

  /** Groups of mutually convertible units: linear, affine (temperature) and reciprocal (fuel, pace). */
  private static final List<List<String>> GROUPS = List.of(
      List.of("m", "km", "cm", "mm", "µm", "nm", "in", "ft", "yd", "mi", "nmi", "ftm", "rd", "ch", "fur", "thou", "hh",
          "Å", "micron", "ly", "au", "pc", "pt_dtp", "pica", "px", "ft_us", "mi_us", "ch_us", "league", "cable", "mil_sv",
          "dm", "hm", "dam", "Mm", "pm", "fermi", "ls", "twip", "pt_printer", "ftm_us", "rd_us", "li", "li_us", "fur_us"),
      List.of("kg", "g", "mg", "µg", "t", "Mt", "lb", "oz", "gr", "st", "ton_short", "ton_long", "cwt_short", "cwt_long",
          "ozt", "lb_t", "dwt", "ct", "slug", "dr_avdp", "dr_ap", "mcg", "q_metric", "Mg", "ng"),
      List.of("m^3", "L", "mL", "cL", "dL", "µL", "cc", "gal_us", "qt_us", "pt_us", "cup_us", "floz_us", "tbsp_us",
          "tsp_us", "fldr", "gal_imp", "qt_imp", "pt_imp", "floz_imp", "bu_us", "pk_us", "qt_dry", "pt_dry", "bbl", "ft^3",
          "in^3", "yd^3", "cord", "ac_ft", "fbm", "cup_metric", "tbsp_metric", "tsp_metric", "hL", "km^3"),
      List.of("s", "ms", "µs", "ns", "min", "h", "d", "wk", "fortnight", "yr_365", "yr_julian", "yr_gregorian",
          "mo_mean", "decade"),
      List.of("m/s", "km/h", "mph", "kn", "ft/s", "fpm", "ips", "c0", "mi/min", "km/s", "kph", "cm/s"),
      List.of("Pa", "kPa", "MPa", "hPa", "bar", "mbar", "atm", "at", "Torr", "mmHg", "inHg", "psi", "ksi", "psf", "inH2O",
          "mmH2O", "cmH2O", "Ba"),
      List.of("J", "kJ", "MJ", "cal_th", "kcal_th", "cal_IT", "kcal_IT", "Btu_IT", "Btu_th", "kWh", "Wh", "eV", "MeV",
          "erg", "ft·lbf", "thm_EC", "tTNT", "toe"),
      List.of("W", "kW", "MW", "hp_mech", "hp_metric", "hp_elec", "TR", "Btu_IT/h", "erg/s", "VA"),
      List.of("N", "kN", "dyn", "kgf", "lbf", "ozf", "pdl", "kip", "tonf", "gf"),
      List.of("rad", "mrad", "°", "arcmin", "arcsec", "gon", "rev", "mil_nato", "grad", "deg"),
      List.of("m^2", "km^2", "ha", "are", "acre", "ac_us", "ft^2", "in^2", "mi^2", "yd^2", "barn", "dunam"),
      List.of("bit", "B", "kB", "MB", "GB", "KiB", "MiB", "GiB", "kbit", "Mbit", "o", "nibble"),
      List.of("K", "°C", "°F", "°R", "mK", "degC"),
      List.of("L/100km", "mpg", "mpg_imp", "km/L", "mi/gal_us", "L/km"),
      List.of("min/km", "s/m", "min/mi", "km/h", "m/s", "mph"),
      List.of("kg/m^3", "g/cm^3", "lb/ft^3", "g/L", "mg/dL", "oz/in^3"),
      List.of("m^3/s", "L/min", "gpm", "cfm", "cfs", "MGD"));

  private static final List<String[]> PAIRS = pairs();

  private static List<String[]> pairs() {
    List<String[]> out = new ArrayList<>();
    for (List<String> group : GROUPS) {
      for (String a : group) {
        for (String b : group) {
          if (!a.equals(b)) {
            out.add(new String[] {a, b});
          }
        }
      }
    }
    return out;
  }

  @Test
  void sample_hasAtLeast5000CompatiblePairs() {
    assertTrue(PAIRS.size() >= 5000, "pairs: " + PAIRS.size());
  }

  /** Exhaustive over the sample: every ordered pair, three fixed values each. */
  @Test
  void everyPair_roundTripsToTheRequestedDigits() throws ToolException {
    for (String[] pair : PAIRS) {
      Random random = new Random((pair[0] + "|" + pair[1]).hashCode()); // a fixed value set per pair
      for (int i = 0; i < 3; i++) {
        int digits = 1 + random.nextInt(15);
        assertRoundTrip(pair, value(random, digits), digits);
      }
    }
  }

  /** Values of up to 15 significant digits over 16 decades, either sign. */
  static Gen<BigDecimal> values() {
    return in -> {
      long mantissa = in.next(Constraint.between(1, 999_999_999_999_999L));
      int exponent = (int) in.next(Constraint.between(-6, 9));
      boolean negative = in.next(Constraint.between(0, 1)) == 1;
      return new BigDecimal(BigInteger.valueOf(negative ? -mantissa : mantissa), 0).movePointLeft(6).scaleByPowerOfTen(exponent - 3);
    };
  }

  /** Random pairs, values and digit counts on top (QuickTheories, fixed seed). */
  @Test
  void randomPairsAndValues_roundTrip() {
    Gen<String[]> pairs = in -> PAIRS.get((int) in.next(Constraint.between(0, PAIRS.size() - 1)));
    Gen<Integer> digitCounts = in -> (int) in.next(Constraint.between(1, 15));
    qt().withExamples(2000).withFixedSeed(5380L).forAll(pairs, values(), digitCounts).checkAssert((pair, raw, digits) -> {
      BigDecimal value = raw.round(new java.math.MathContext(digits, RoundingMode.HALF_EVEN));
      try {
        assertRoundTrip(pair, value, digits);
      } catch (ToolException e) {
        throw new AssertionError(pair[0] + " -> " + pair[1] + ": " + e.error().text(), e);
      }
    });
  }

  private static void assertRoundTrip(String[] pair, BigDecimal value, int digits) throws ToolException {
    Unit a = unit(pair[0]);
    Unit b = unit(pair[1]);
    BigDecimal there = Rounder.toDigits(Converter.convert(Rational.of(value), a, pair[0], b, pair[1]), 34,
        RoundingMode.HALF_EVEN);
    BigDecimal back = Rounder.toDigits(Converter.convert(Rational.of(there), b, pair[1], a, pair[0]), digits,
        RoundingMode.HALF_EVEN);
    assertEquals(0, value.compareTo(back), () -> value + " " + pair[0] + " -> " + there + " " + pair[1] + " -> " + back);
  }

  private static BigDecimal value(Random random, int digits) {
    long bound = (long) Math.pow(10, Math.min(digits, 15));
    long mantissa = 1 + Math.floorMod(random.nextLong(), bound - 1);
    int exponent = random.nextInt(12) - 6;
    BigDecimal v = BigDecimal.valueOf(random.nextBoolean() ? mantissa : -mantissa).scaleByPowerOfTen(exponent);
    return v.round(new java.math.MathContext(digits, RoundingMode.HALF_EVEN));
  }

  private static synchronized Unit unit(String expression) throws ToolException {
    Unit u = PARSED.get(expression);
    if (u == null) {
      u = UnitParser.parse(expression, TABLE);
      PARSED.put(expression, u);
    }
    return u;
  }
}
