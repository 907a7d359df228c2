package reckoner.units;

import java.math.BigDecimal;
import java.math.BigInteger;

/**
 * Pi to as many digits as a rounding needs, by Machin's formula pi = 16 atan(1/5) - 4 atan(1/239)
 * in exact integer arithmetic. The longest expansion so far is kept; thread-safe.
 */
final class Pi {
  private static volatile BigDecimal cached = compute(120);

  private Pi() {}

  /** Pi correct to at least {@code digits} significant digits (truncated, with guard digits dropped). */
  static BigDecimal toDigits(int digits) {
    BigDecimal pi = cached;
    if (pi.precision() < digits) {
      synchronized (Pi.class) {
        pi = cached;
        if (pi.precision() < digits) {
          pi = compute(Math.max(digits, pi.precision() * 2));
          cached = pi;
        }
      }
    }
    return pi;
  }

  private static BigDecimal compute(int digits) {
    int guard = 10;
    BigInteger scale = BigInteger.TEN.pow(digits + guard);
    BigInteger pi = arctanInverse(5, scale).multiply(BigInteger.valueOf(16))
        .subtract(arctanInverse(239, scale).multiply(BigInteger.valueOf(4)));
    // Each series term is truncated, so the sum is off by at most a few units of the last guard digit.
    return new BigDecimal(pi.divide(BigInteger.TEN.pow(guard)), digits);
  }

  /** atan(1/x) times {@code scale}, as an integer. */
  private static BigInteger arctanInverse(int x, BigInteger scale) {
    BigInteger xSquared = BigInteger.valueOf((long) x * x);
    BigInteger term = scale.divide(BigInteger.valueOf(x));
    BigInteger sum = term;
    for (int n = 1; term.signum() != 0; n++) {
      term = term.divide(xSquared);
      BigInteger t = term.divide(BigInteger.valueOf(2L * n + 1));
      sum = n % 2 == 1 ? sum.subtract(t) : sum.add(t);
    }
    return sum;
  }
}
