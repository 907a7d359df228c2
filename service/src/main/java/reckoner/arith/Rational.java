package reckoner.arith;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * An exact rational number {@code num / den} with {@code den > 0}, for arith@2. Not always in
 * lowest terms: fractions are reduced only while both parts are small enough for a cheap greatest
 * common divisor, since the value (and so every answer) is the same either way. Every result
 * stays within {@code 1e-9999 <= |x| < 1e10000} ({@code overflow}) and within {@link #MAX_BITS}
 * bits per part ({@link TooLarge}, which sends the caller to the bounded evaluation). Immutable.
 */
record Rational(BigInteger num, BigInteger den) {
  /** Enough for every integer below 1e10000 (33,220 bits). */
  static final int MAX_BITS = 34_000;
  /** Fractions are put in lowest terms while both parts are at most this long. */
  private static final int REDUCE_BITS = 4096;
  static final int MAX_EXPONENT = 9999;

  static final Rational ZERO = new Rational(BigInteger.ZERO, BigInteger.ONE);
  static final Rational ONE = new Rational(BigInteger.ONE, BigInteger.ONE);
  static final Rational HUNDRED = new Rational(BigInteger.valueOf(100), BigInteger.ONE);

  private static final BigInteger TEN_POW_LIMIT = BigInteger.TEN.pow(MAX_EXPONENT + 1);
  private static final BigInteger TEN_POW_FLOOR = BigInteger.TEN.pow(MAX_EXPONENT);

  /** Thrown when an exact part would exceed {@link #MAX_BITS}; never reaches a caller. */
  static final class TooLarge extends Exception {
    private static final long serialVersionUID = 1L;

    TooLarge() {
      super(null, null, false, false);
    }
  }

  Rational {
    if (den.signum() <= 0) {
      throw new IllegalArgumentException("denominator must be positive: " + den);
    }
  }

  static Rational of(long n) {
    return new Rational(BigInteger.valueOf(n), BigInteger.ONE);
  }

  static Rational of(BigInteger n) {
    return new Rational(n, BigInteger.ONE);
  }

  /** The exact value of a decimal. */
  static Rational of(BigDecimal d) {
    if (d.signum() == 0) {
      return ZERO;
    }
    BigDecimal s = d.stripTrailingZeros();
    return s.scale() <= 0
        ? new Rational(s.unscaledValue().multiply(BigInteger.TEN.pow(-s.scale())), BigInteger.ONE)
        : reduced(s.unscaledValue(), BigInteger.TEN.pow(s.scale()));
  }

  static Rational fraction(BigInteger n, BigInteger d) throws ToolException {
    if (d.signum() == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "division by zero");
    }
    return d.signum() < 0 ? reduced(n.negate(), d.negate()) : reduced(n, d);
  }

  private static Rational reduced(BigInteger n, BigInteger d) {
    if (d.equals(BigInteger.ONE) || n.bitLength() > REDUCE_BITS || d.bitLength() > REDUCE_BITS) {
      return new Rational(n, d);
    }
    if (n.bitLength() < 63 && d.bitLength() < 63) { // the common case, without BigInteger's general gcd
      long a = n.longValue();
      long b = d.longValue();
      long g = gcd(Math.abs(a), b);
      return g == 1 ? new Rational(n, d) : new Rational(BigInteger.valueOf(a / g), BigInteger.valueOf(b / g));
    }
    BigInteger g = n.gcd(d);
    return g.equals(BigInteger.ONE) ? new Rational(n, d) : new Rational(n.divide(g), d.divide(g));
  }

  private static long gcd(long a, long b) {
    while (b != 0) {
      long t = a % b;
      a = b;
      b = t;
    }
    return a;
  }

  int signum() {
    return num.signum();
  }

  boolean isInteger() {
    return den.equals(BigInteger.ONE) || num.mod(den).signum() == 0;
  }

  /** The integer value; only for {@link #isInteger()} values. */
  BigInteger toInteger() {
    return den.equals(BigInteger.ONE) ? num : num.divide(den);
  }

  Rational negate() {
    return new Rational(num.negate(), den);
  }

  Rational abs() {
    return num.signum() < 0 ? negate() : this;
  }

  int compareTo(Rational o) {
    return num.multiply(o.den).compareTo(o.num.multiply(den));
  }

  // ---- arithmetic: exact, then checked for range and size ----

  Rational add(Rational o) throws ToolException, TooLarge {
    if (den.equals(o.den)) {
      return checked(reduced(num.add(o.num), den));
    }
    sizeCheck((long) Math.max(num.bitLength() + o.den.bitLength(), o.num.bitLength() + den.bitLength()) + 1);
    sizeCheck((long) den.bitLength() + o.den.bitLength());
    return checked(reduced(num.multiply(o.den).add(o.num.multiply(den)), den.multiply(o.den)));
  }

  Rational subtract(Rational o) throws ToolException, TooLarge {
    return add(o.negate());
  }

  Rational multiply(Rational o) throws ToolException, TooLarge {
    if (num.signum() == 0 || o.num.signum() == 0) {
      return ZERO;
    }
    sizeCheck((long) num.bitLength() + o.num.bitLength());
    sizeCheck((long) den.bitLength() + o.den.bitLength());
    return checked(reduced(num.multiply(o.num), den.multiply(o.den)));
  }

  Rational divide(Rational o) throws ToolException, TooLarge {
    if (o.num.signum() == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "division by zero");
    }
    if (num.signum() == 0) {
      return ZERO;
    }
    sizeCheck((long) num.bitLength() + o.den.bitLength());
    sizeCheck((long) den.bitLength() + o.num.bitLength());
    BigInteger n = num.multiply(o.den);
    BigInteger d = den.multiply(o.num);
    return checked(d.signum() < 0 ? reduced(n.negate(), d.negate()) : reduced(n, d));
  }

  /**
   * {@code this - o * q} where q is the quotient rounded toward negative infinity ({@code floor},
   * the result takes the sign of o) or toward zero (the sign of this). On a common denominator
   * the remainder is one of integers, so the quotient itself — which for 1e9999 mod 1e-9999 has
   * 20,000 digits — is never a value of the expression and never overflows it.
   */
  Rational remainder(Rational o, boolean floor) throws ToolException, TooLarge {
    if (o.num.signum() == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "modulo by zero");
    }
    sizeCheck((long) den.bitLength() + o.den.bitLength());
    BigInteger common = den.multiply(o.den);
    BigInteger a = num.multiply(o.den);
    BigInteger b = o.num.multiply(den);
    BigInteger r = a.remainder(b); // the sign of a
    if (floor && r.signum() != 0 && r.signum() != b.signum()) {
      r = r.add(b);
    }
    return checked(reduced(r, common));
  }

  /** {@code this ^ n} for a whole {@code n}; the caller has bounded |n|. */
  Rational pow(int n) throws ToolException, TooLarge {
    if (n == 0) {
      return ONE;
    }
    if (num.signum() == 0) {
      if (n < 0) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "zero raised to a negative power");
      }
      return ZERO;
    }
    int m = Math.abs(n);
    double log10 = log10Abs();
    double estimate = log10 * n;
    if (estimate > MAX_EXPONENT + 2) {
      throw tooLargeResult();
    }
    if (estimate < -MAX_EXPONENT - 2) {
      throw tooSmallResult();
    }
    sizeCheck((long) Math.ceil(Math.max(log2(num.abs()), log2(den)) * m) + 1);
    BigInteger pn = num.pow(m);
    BigInteger pd = den.pow(m);
    Rational r = n > 0 ? new Rational(pn, pd) : pn.signum() < 0 ? new Rational(pd.negate(), pn.negate()) : new Rational(pd, pn);
    return checked(r);
  }

  /** An approximation of {@code log10(|this|)} for estimates; this must not be zero. */
  double log10Abs() {
    return log10(num.abs()) - log10(den);
  }

  /** log2(x) for x >= 1, to a few parts in 1e15. */
  private static double log2(BigInteger x) {
    int shift = Math.max(0, x.bitLength() - 60);
    return StrictMath.log(x.shiftRight(shift).doubleValue()) / StrictMath.log(2.0) + shift;
  }

  private static double log10(BigInteger x) {
    int shift = Math.max(0, x.bitLength() - 60);
    return StrictMath.log10(x.shiftRight(shift).doubleValue()) + shift * StrictMath.log10(2.0);
  }

  // ---- conversions ----

  /** The value rounded to {@code mc} (exactly: one correctly rounded division). */
  BigDecimal round(MathContext mc) {
    if (den.equals(BigInteger.ONE)) {
      return new BigDecimal(num).round(mc);
    }
    return new BigDecimal(num).divide(new BigDecimal(den), mc);
  }

  /** The value rounded to {@code places} digits after the point (negative: tens, hundreds...). */
  BigDecimal roundToPlaces(int places, RoundingMode mode) {
    if (den.equals(BigInteger.ONE)) {
      return new BigDecimal(num).setScale(places, mode);
    }
    return new BigDecimal(num).divide(new BigDecimal(den), places, mode);
  }

  /** The exact decimal value, when the denominator has no prime factors but 2 and 5. */
  java.util.Optional<BigDecimal> toExactDecimal() {
    if (den.equals(BigInteger.ONE)) {
      return java.util.Optional.of(new BigDecimal(num));
    }
    int twos = den.getLowestSetBit();
    BigInteger rest = den.shiftRight(twos);
    int fives = 0;
    BigInteger five = BigInteger.valueOf(5);
    while (rest.mod(five).signum() == 0) {
      rest = rest.divide(five);
      fives++;
    }
    if (!rest.equals(BigInteger.ONE)) {
      return java.util.Optional.empty();
    }
    int k = Math.max(twos, fives);
    // num / (2^twos 5^fives) = num * 2^(k-twos) * 5^(k-fives) / 10^k
    BigInteger scaled = num.shiftLeft(k - twos).multiply(five.pow(k - fives));
    return java.util.Optional.of(new BigDecimal(scaled, k));
  }

  // ---- checks ----

  static void sizeCheck(long bits) throws TooLarge {
    if (bits > MAX_BITS) {
      throw new TooLarge();
    }
  }

  /** This value, or overflow when it lies outside {@code 1e-9999 <= |x| < 1e10000}. */
  Rational checked() throws ToolException {
    return checked(this);
  }

  private static Rational checked(Rational r) throws ToolException {
    if (r.num.signum() == 0) {
      return r.den.equals(BigInteger.ONE) ? r : ZERO;
    }
    long log2 = (long) r.num.abs().bitLength() - r.den.bitLength(); // log2|x| lies in (log2 - 1, log2 + 1)
    if (log2 + 1 > 33_218 && (log2 - 1 >= 33_220 || r.num.abs().compareTo(r.den.multiply(TEN_POW_LIMIT)) >= 0)) {
      throw tooLargeResult();
    }
    if (log2 - 1 < -33_214 && (log2 + 1 <= -33_217 || r.num.abs().multiply(TEN_POW_FLOOR).compareTo(r.den) < 0)) {
      throw tooSmallResult();
    }
    return r;
  }

  static ToolException tooLargeResult() {
    return new ToolException(ErrorCode.OVERFLOW, "the result is too large (|x| must stay below 1e" + (MAX_EXPONENT + 1) + ")");
  }

  static ToolException tooSmallResult() {
    return new ToolException(ErrorCode.OVERFLOW, "the result is too small (|x| must stay at or above 1e-" + MAX_EXPONENT + ")");
  }

  @Override
  public String toString() {
    return den.equals(BigInteger.ONE) ? num.toString() : num + "/" + den;
  }
}
