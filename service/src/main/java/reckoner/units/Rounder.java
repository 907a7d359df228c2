package reckoner.units;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Rounds an exact result (a rational times a power of pi) once, correctly. A rational result is
 * divided out exactly by BigDecimal, which rounds correctly in every mode. A result with pi is
 * evaluated with guard digits and an error bound, and again with twice the digits until both ends
 * of the bound round alike; pi is irrational, so this always ends. Pure functions.
 */
final class Rounder {
  private static final int MAX_PRECISION = 5000;

  private Rounder() {}

  /** {@code x} to {@code digits} significant digits. */
  static BigDecimal toDigits(Factor x, int digits, RoundingMode mode) {
    MathContext target = new MathContext(digits, mode);
    if (x.isRational() || x.coefficient().isZero()) {
      return x.coefficient().toBigDecimal(target);
    }
    int precision = digits + 15;
    while (true) {
      BigDecimal[] bounds = bounds(x, precision);
      BigDecimal lo = bounds[0].round(target);
      BigDecimal hi = bounds[1].round(target);
      if (lo.compareTo(hi) == 0 || precision > MAX_PRECISION) {
        return lo;
      }
      precision *= 2;
    }
  }

  /** {@code x} to {@code places} digits after the point (negative: tens, hundreds). */
  static BigDecimal toPlaces(Factor x, int places, RoundingMode mode) {
    if (x.isRational() || x.coefficient().isZero()) {
      return x.coefficient().toBigDecimal(places, mode);
    }
    double log = x.coefficient().log10Estimate() + x.piPower() * 0.4971;
    int precision = (int) Math.max(0, Math.ceil(log) + 2) + Math.max(places, 0) + 15;
    while (true) {
      BigDecimal[] bounds = bounds(x, precision);
      BigDecimal lo = bounds[0].setScale(places, mode);
      BigDecimal hi = bounds[1].setScale(places, mode);
      if (lo.compareTo(hi) == 0 || precision > MAX_PRECISION) {
        return lo;
      }
      precision *= 2;
    }
  }

  /** {@code x} to within a relative 10^-(precision-3): pi expanded to enough digits. For an irrational {@code x} only. */
  static BigDecimal approximate(Factor x, int precision) {
    BigDecimal[] b = bounds(x, precision);
    return b[0].add(b[1]).divide(BigDecimal.valueOf(2), new MathContext(precision + 5, RoundingMode.HALF_EVEN));
  }

  /** An interval around {@code x} of relative width about 10^-(precision-3). */
  private static BigDecimal[] bounds(Factor x, int precision) {
    MathContext mc = new MathContext(precision + 5, RoundingMode.HALF_EVEN);
    BigDecimal pi = Pi.toDigits(precision + 10);
    BigDecimal piPower = x.piPower() > 0 ? pi.pow(x.piPower(), mc) : BigDecimal.ONE.divide(pi.pow(-x.piPower(), mc), mc);
    BigDecimal approx = x.coefficient().toBigDecimal(mc).multiply(piPower, mc);
    BigDecimal error = approx.abs().movePointLeft(precision - 3); // far above the few ulps lost above
    return new BigDecimal[] {approx.subtract(error), approx.add(error)};
  }
}
