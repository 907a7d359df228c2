package reckoner.units;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Objects;

/**
 * An exact fraction of two integers, always in lowest terms with a positive denominator, so that
 * equal values are equal objects. Unit factors and converted values are carried as rationals
 * until the final rounding; a binary double never touches them. Immutable.
 */
final class Rational implements Comparable<Rational> {
  static final Rational ZERO = new Rational(BigInteger.ZERO, BigInteger.ONE);
  static final Rational ONE = new Rational(BigInteger.ONE, BigInteger.ONE);

  private final BigInteger numerator;
  private final BigInteger denominator;

  private Rational(BigInteger numerator, BigInteger denominator) {
    this.numerator = numerator;
    this.denominator = denominator;
  }

  static Rational of(BigInteger numerator, BigInteger denominator) {
    Objects.requireNonNull(numerator, "numerator");
    if (denominator.signum() == 0) {
      throw new ArithmeticException("zero denominator");
    }
    if (denominator.signum() < 0) {
      numerator = numerator.negate();
      denominator = denominator.negate();
    }
    BigInteger gcd = numerator.gcd(denominator);
    if (!gcd.equals(BigInteger.ONE) && gcd.signum() != 0) {
      numerator = numerator.divide(gcd);
      denominator = denominator.divide(gcd);
    }
    return numerator.signum() == 0 ? ZERO : new Rational(numerator, denominator);
  }

  static Rational of(long numerator, long denominator) {
    return of(BigInteger.valueOf(numerator), BigInteger.valueOf(denominator));
  }

  static Rational of(long value) {
    return of(BigInteger.valueOf(value), BigInteger.ONE);
  }

  /** The exact value of a decimal: its unscaled digits over a power of ten. */
  static Rational of(BigDecimal value) {
    int scale = value.scale();
    return scale >= 0
        ? of(value.unscaledValue(), BigInteger.TEN.pow(scale))
        : of(value.unscaledValue().multiply(BigInteger.TEN.pow(-scale)), BigInteger.ONE);
  }

  /**
   * Parses the table's literal forms: a decimal ({@code 0.0254}, {@code 1e-3}) or a fraction of
   * two decimals ({@code 5/9}, {@code 1/0.3048}). Throws {@link NumberFormatException} otherwise.
   */
  static Rational parse(String text) {
    int slash = text.indexOf('/');
    if (slash < 0) {
      return of(new BigDecimal(text));
    }
    return of(new BigDecimal(text.substring(0, slash))).divide(of(new BigDecimal(text.substring(slash + 1))));
  }

  BigInteger numerator() {
    return numerator;
  }

  BigInteger denominator() {
    return denominator;
  }

  int signum() {
    return numerator.signum();
  }

  boolean isZero() {
    return numerator.signum() == 0;
  }

  Rational plus(Rational other) {
    return of(numerator.multiply(other.denominator).add(other.numerator.multiply(denominator)),
        denominator.multiply(other.denominator));
  }

  Rational minus(Rational other) {
    return plus(other.negate());
  }

  Rational negate() {
    return numerator.signum() == 0 ? this : new Rational(numerator.negate(), denominator);
  }

  Rational times(Rational other) {
    return of(numerator.multiply(other.numerator), denominator.multiply(other.denominator));
  }

  Rational divide(Rational other) {
    return of(numerator.multiply(other.denominator), denominator.multiply(other.numerator));
  }

  Rational reciprocal() {
    return of(denominator, numerator);
  }

  /** This value raised to a whole power; a negative power of zero throws ArithmeticException. */
  Rational pow(int exponent) {
    if (exponent >= 0) {
      return new Rational(numerator.pow(exponent), denominator.pow(exponent));
    }
    return reciprocal().pow(-exponent);
  }

  /** Rounded to {@code mc}'s significant digits, correctly (BigDecimal division is exact-then-rounded). */
  BigDecimal toBigDecimal(MathContext mc) {
    return new BigDecimal(numerator).divide(new BigDecimal(denominator), mc);
  }

  /** Rounded to {@code scale} digits after the point. */
  BigDecimal toBigDecimal(int scale, RoundingMode mode) {
    return new BigDecimal(numerator).divide(new BigDecimal(denominator), scale, mode);
  }

  /** An estimate of log10(|this|), good to about one; for sizing precisions only. Zero gives 0. */
  double log10Estimate() {
    if (isZero()) {
      return 0;
    }
    return (numerator.abs().bitLength() - denominator.bitLength()) * 0.30103;
  }

  @Override
  public int compareTo(Rational other) {
    return numerator.multiply(other.denominator).compareTo(other.numerator.multiply(denominator));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Rational r && numerator.equals(r.numerator) && denominator.equals(r.denominator);
  }

  @Override
  public int hashCode() {
    return numerator.hashCode() * 31 + denominator.hashCode();
  }

  /** {@code n} or {@code n/d}. */
  @Override
  public String toString() {
    return denominator.equals(BigInteger.ONE) ? numerator.toString() : numerator + "/" + denominator;
  }
}
