package reckoner.arith;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.Optional;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * n-th roots of rationals on integers alone: exact when the root is rational, otherwise correctly
 * rounded to 34 significant digits (ties to even), the same on every JVM. Pure functions.
 */
final class Roots {
  static final int MAX_DEGREE = 100;
  static final MathContext DIGITS_34 = MathContext.DECIMAL128;

  private Roots() {}

  /** The n-th root of {@code x}: odd roots of negatives are negative; even roots of negatives fail. */
  static Rational root(Rational x, int n) throws ToolException {
    if (n < 1 || n > MAX_DEGREE) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "the degree of a root must be a whole number from 1 to " + MAX_DEGREE);
    }
    if (x.signum() == 0 || n == 1) {
      return x;
    }
    if (x.signum() < 0) {
      if (n % 2 == 0) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, n == 2 ? "square root of a negative number"
            : "an even root (" + n + ") of a negative number");
      }
      return root(x.negate(), n).negate();
    }
    Optional<Rational> exact = exactRoot(x, n);
    if (exact.isPresent()) {
      return exact.get();
    }
    return Rational.of(rounded(x, n));
  }

  /** The root when it is rational and the numbers stay within the size limit, else empty. x > 0. */
  static Optional<Rational> exactRoot(Rational x, int n) {
    // x = p/q is an n-th power of a rational iff p * q^(n-1) is an n-th power of an integer.
    long bits = x.num().bitLength() + (long) (n - 1) * x.den().bitLength();
    if (bits > Rational.MAX_BITS) {
      return Optional.empty();
    }
    BigInteger m = x.num().multiply(x.den().pow(n - 1));
    BigInteger r = iroot(m, n);
    if (!r.pow(n).equals(m)) {
      return Optional.empty();
    }
    return Optional.of(new Rational(r, x.den()));
  }

  /** The root of x > 0 correctly rounded to 34 significant digits, ties to even. */
  static BigDecimal rounded(Rational x, int n) {
    // Scale x by 10^(n*k) so that the integer root has at least 36 digits, then round with a sticky digit.
    double log10 = x.log10Abs();
    int k = (int) Math.ceil(36 - Math.floor(log10 / n)) + 1;
    BigInteger scaled;
    long shift = (long) n * k;
    if (shift >= 0) {
      scaled = x.num().multiply(BigInteger.TEN.pow((int) shift)).divide(x.den());
    } else {
      scaled = x.num().divide(x.den().multiply(BigInteger.TEN.pow((int) -shift)));
    }
    BigInteger r = iroot(scaled, n);
    boolean exact = r.pow(n).equals(scaled) && (shift >= 0
        ? x.num().multiply(BigInteger.TEN.pow((int) shift)).mod(x.den()).signum() == 0
        : x.num().mod(x.den().multiply(BigInteger.TEN.pow((int) -shift))).signum() == 0);
    BigDecimal value = exact ? new BigDecimal(r, k) : new BigDecimal(r.multiply(BigInteger.TEN).add(BigInteger.ONE), k + 1);
    return value.round(DIGITS_34);
  }

  /** {@code floor(m^(1/n))} for m >= 0, by Newton's method on integers. */
  static BigInteger iroot(BigInteger m, int n) {
    if (m.signum() == 0 || m.equals(BigInteger.ONE)) {
      return m;
    }
    if (n == 2) {
      return m.sqrt();
    }
    BigInteger bn = BigInteger.valueOf(n);
    BigInteger nMinus1 = BigInteger.valueOf(n - 1);
    // Newton's method from above shrinks only by (n-1)/n a step while far from the root, so start
    // just above it: 2^(log2(m)/n) from doubles, raised by a margin far beyond their error, when
    // that is checked to lie above the root; else 2^ceil(bits/n), which always does.
    BigInteger x = BigInteger.ONE.shiftLeft((m.bitLength() + n - 1) / n);
    int shift = Math.max(0, m.bitLength() - 60);
    double log2 = (StrictMath.log(m.shiftRight(shift).doubleValue()) / StrictMath.log(2.0) + shift) / n;
    double whole = Math.floor(log2);
    long mantissa = (long) Math.ceil(StrictMath.pow(2.0, log2 - whole) * (1L << 52) * (1 + 1e-9)) + 1;
    BigInteger estimate = whole >= 52 ? BigInteger.valueOf(mantissa).shiftLeft((int) whole - 52)
        : BigInteger.valueOf(mantissa).shiftRight(52 - (int) whole).add(BigInteger.ONE);
    if (estimate.compareTo(x) < 0 && estimate.pow(n).compareTo(m) > 0) {
      x = estimate;
    }
    while (true) {
      BigInteger y = nMinus1.multiply(x).add(m.divide(x.pow(n - 1))).divide(bn);
      if (y.compareTo(x) >= 0) {
        return x;
      }
      x = y;
    }
  }
}
