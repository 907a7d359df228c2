package reckoner.units;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.List;
import java.util.Optional;
import reckoner.tool.DecimalText;

/**
 * Writes a value in a target of parts, largest first ({@code 5 ft 10.8661 in}): the value is
 * split exactly into whole larger units, and only the last (smallest) part is rounded, to the
 * significant digits or places asked; a rounding that reaches a whole next-larger unit carries
 * into it ({@code 11.99999 in} at 4 digits is {@code 1 ft 0 in}). A negative value shows one
 * minus sign, before the first part. Every part is shown, zeros included. Pure functions.
 */
final class Breakdown {
  private Breakdown() {}

  /**
   * @param exact the value in the target's last unit
   * @param units the target's parts, each a whole multiple of the next (checked by {@link Resolver})
   * @param written the parts as the caller wrote them
   */
  static String format(Factor exact, List<Unit> units, List<String> written, Optional<Integer> places, int digits,
      RoundingMode mode, boolean pad) {
    int n = units.size();
    Rational total = exact.isRational() || exact.coefficient().isZero()
        ? exact.coefficient()
        : Rational.of(Rounder.approximate(exact, Math.max(60, digits + 40
            + (int) Math.abs(exact.coefficient().log10Estimate()))));
    boolean negative = total.signum() < 0;
    Rational rest = negative ? total.negate() : total;
    BigInteger[] ratio = new BigInteger[n - 1]; // unit i is ratio[i] of unit i+1
    for (int i = 0; i < n - 1; i++) {
      ratio[i] = units.get(i).factor().divide(units.get(i + 1).factor()).coefficient().numerator();
    }
    BigInteger[] whole = new BigInteger[n - 1];
    for (int i = 0; i < n - 1; i++) {
      BigInteger size = BigInteger.ONE;
      for (int j = i; j < n - 1; j++) {
        size = size.multiply(ratio[j]);
      }
      Rational sized = Rational.of(size, BigInteger.ONE);
      whole[i] = floor(rest.divide(sized));
      rest = rest.minus(Rational.of(whole[i], BigInteger.ONE).times(sized));
    }
    RoundingMode magnitude = onMagnitude(mode, negative);
    BigDecimal last = places.isPresent()
        ? rest.toBigDecimal(places.get(), magnitude)
        : rest.isZero() ? BigDecimal.ZERO : rest.toBigDecimal(new MathContext(digits, magnitude));
    if (n > 1 && last.compareTo(new BigDecimal(ratio[n - 2])) >= 0) { // rounded up to a whole larger unit
      last = last.subtract(new BigDecimal(ratio[n - 2]));
      whole[n - 2] = whole[n - 2].add(BigInteger.ONE);
      for (int i = n - 2; i > 0 && whole[i].compareTo(ratio[i - 1]) >= 0; i--) {
        whole[i] = whole[i].subtract(ratio[i - 1]);
        whole[i - 1] = whole[i - 1].add(BigInteger.ONE);
      }
    }
    boolean zero = last.signum() == 0;
    for (BigInteger w : whole) {
      zero &= w.signum() == 0;
    }
    StringBuilder sb = new StringBuilder();
    if (negative && !zero) {
      sb.append('-');
    }
    for (int i = 0; i < n - 1; i++) {
      sb.append(whole[i]).append(' ').append(written.get(i)).append(' ');
    }
    return sb.append(DecimalText.format(last, pad)).append(' ').append(written.get(n - 1)).toString();
  }

  private static BigInteger floor(Rational r) {
    BigInteger[] qr = r.numerator().divideAndRemainder(r.denominator());
    return r.signum() < 0 && qr[1].signum() != 0 ? qr[0].subtract(BigInteger.ONE) : qr[0];
  }

  /** The mode that rounds a magnitude as {@code mode} rounds the signed value. */
  private static RoundingMode onMagnitude(RoundingMode mode, boolean negative) {
    switch (mode) {
      case CEILING:
        return negative ? RoundingMode.DOWN : RoundingMode.UP;
      case FLOOR:
        return negative ? RoundingMode.UP : RoundingMode.DOWN;
      default:
        return mode;
    }
  }
}
