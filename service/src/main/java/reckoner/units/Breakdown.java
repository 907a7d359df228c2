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
 * into it ({@code 11.99999 in} at 4 digits is {@code 1 ft 0 in}). Every part is shown, zeros
 * included; for a negative value every part that is not zero is negative, so that the parts add
 * up to the value ({@code -7 ft -6 in}, as ICU4J's mixed units write it). Pure functions.
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
        : padded(rest.isZero() ? BigDecimal.ZERO : rest.toBigDecimal(new MathContext(digits, magnitude)), digits);
    if (n > 1 && last.compareTo(new BigDecimal(ratio[n - 2])) >= 0) { // rounded up to a whole larger unit
      last = last.subtract(new BigDecimal(ratio[n - 2]));
      whole[n - 2] = whole[n - 2].add(BigInteger.ONE);
      for (int i = n - 2; i > 0 && whole[i].compareTo(ratio[i - 1]) >= 0; i--) {
        whole[i] = whole[i].subtract(ratio[i - 1]);
        whole[i - 1] = whole[i - 1].add(BigInteger.ONE);
      }
    }
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < n - 1; i++) {
      sb.append(negative ? whole[i].negate() : whole[i]).append(' ').append(written.get(i)).append(' ');
    }
    return sb.append(DecimalText.format(negative ? last.negate() : last, pad)).append(' ').append(written.get(n - 1))
        .toString();
  }

  /**
   * {@code value} with the zeros that {@code digits} significant digits show (25.4 at 5 digits is
   * 25.400), for pad_zeros: an exact result shorter than the digits asked keeps them in units@2.
   */
  static BigDecimal padded(BigDecimal value, int digits) {
    int missing = digits - (value.signum() == 0 ? 1 : value.precision());
    return missing > 0 ? value.setScale(value.scale() + missing) : value;
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
