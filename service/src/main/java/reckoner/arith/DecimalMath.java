package reckoner.arith;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Decimal arithmetic with the tool's semantics: every operation's exact result is rounded to 34
 * significant digits, ties to even (the precision of IEEE 754-2019 decimal128), and results must
 * lie within {@code 1e-9999 <= |x| < 1e10000}. Pure functions; thread-safe.
 */
final class DecimalMath {
  static final MathContext CONTEXT = MathContext.DECIMAL128;
  static final int MAX_EXPONENT = 9999;
  static final int MAX_POWER = 100_000;
  /** Exact powers up to this many digits; beyond, a 60-digit working precision. */
  private static final int EXACT_POWER_DIGITS = 2000;
  private static final MathContext WIDE = new MathContext(60, RoundingMode.HALF_EVEN);

  static final BigDecimal PI = new BigDecimal("3.141592653589793238462643383279503");
  static final BigDecimal E = new BigDecimal("2.718281828459045235360287471352662");

  private DecimalMath() {}

  /** The decimal exponent of a non-zero value: {@code floor(log10(|x|))}. */
  static int exponentOf(BigDecimal x) {
    return x.precision() - x.scale() - 1;
  }

  static BigDecimal checked(BigDecimal x) throws ToolException {
    if (x.signum() == 0) {
      return BigDecimal.ZERO;
    }
    int exponent = exponentOf(x);
    if (exponent > MAX_EXPONENT) {
      throw new ToolException(ErrorCode.OVERFLOW, "the result is too large (|x| must stay below 1e" + (MAX_EXPONENT + 1) + ")");
    }
    if (exponent < -MAX_EXPONENT) {
      throw new ToolException(ErrorCode.OVERFLOW, "the result is too small (|x| must stay at or above 1e-" + MAX_EXPONENT + ")");
    }
    return x;
  }

  static BigDecimal add(BigDecimal a, BigDecimal b) throws ToolException {
    return checked(a.add(b, CONTEXT));
  }

  static BigDecimal subtract(BigDecimal a, BigDecimal b) throws ToolException {
    return checked(a.subtract(b, CONTEXT));
  }

  static BigDecimal multiply(BigDecimal a, BigDecimal b) throws ToolException {
    return checked(a.multiply(b, CONTEXT));
  }

  static BigDecimal divide(BigDecimal a, BigDecimal b) throws ToolException {
    if (b.signum() == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "division by zero");
    }
    return checked(a.divide(b, CONTEXT));
  }

  /** Truncated remainder (sign of the dividend), as C's fmod and Java's {@code %}. */
  static BigDecimal remainder(BigDecimal a, BigDecimal b) throws ToolException {
    if (b.signum() == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "modulo by zero");
    }
    return checked(exactRemainder(a, b).round(CONTEXT));
  }

  /**
   * {@code a - b * trunc(a / b)}, exactly, without ever forming the quotient (which for
   * {@code 1e9999 % 1e-9999} has 20,000 digits): on a common scale the remainder of
   * {@code ma * 10^k} by {@code mb} is {@code (ma mod mb) * (10^k mod mb) mod mb}.
   */
  private static BigDecimal exactRemainder(BigDecimal a, BigDecimal b) {
    BigInteger ma = a.unscaledValue().abs();
    BigInteger mb = b.unscaledValue().abs();
    BigInteger r;
    int scale;
    if (b.scale() >= a.scale()) {
      scale = b.scale();
      BigInteger shift = BigInteger.TEN.modPow(BigInteger.valueOf((long) b.scale() - a.scale()), mb);
      r = ma.mod(mb).multiply(shift).mod(mb);
    } else {
      scale = a.scale();
      r = ma.mod(mb.multiply(BigInteger.TEN.pow(a.scale() - b.scale())));
    }
    BigDecimal result = new BigDecimal(r, scale);
    return a.signum() < 0 ? result.negate() : result;
  }

  /** {@code base ^ exponent}: decimal for whole exponents, binary double otherwise. */
  static BigDecimal power(BigDecimal base, BigDecimal exponent) throws ToolException {
    if (exponent.signum() == 0) {
      return BigDecimal.ONE; // 0^0 = 1, as IEEE 754 pow
    }
    if (base.signum() == 0) {
      if (exponent.signum() < 0) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "zero raised to a negative power");
      }
      return BigDecimal.ZERO;
    }
    if (isWhole(exponent)) {
      if (exponent.abs().compareTo(BigDecimal.valueOf(MAX_POWER)) > 0) {
        if (base.abs().compareTo(BigDecimal.ONE) == 0) {
          return exponent.toBigInteger().testBit(0) ? base : BigDecimal.ONE;
        }
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED,
            "the exponent " + shortText(exponent) + " exceeds the limit of ±" + MAX_POWER);
      }
      return integerPower(base, exponent.intValueExact());
    }
    if (base.signum() < 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "a negative number raised to a fractional power");
    }
    return fromDouble(StrictMath.pow(base.doubleValue(), exponent.doubleValue()), "power");
  }

  private static BigDecimal integerPower(BigDecimal base, int n) throws ToolException {
    int magnitude = Math.abs(n);
    // Estimate the result's exponent first, so huge results fail before any work is done.
    int e = exponentOf(base);
    double log10 = e + StrictMath.log10(base.abs().movePointLeft(e).doubleValue()); // mantissa in [1, 10)
    if (Double.isFinite(log10)) {
      double estimate = log10 * n;
      if (estimate > MAX_EXPONENT + 2) {
        throw new ToolException(ErrorCode.OVERFLOW, "the result is too large (|x| must stay below 1e" + (MAX_EXPONENT + 1) + ")");
      }
      if (estimate < -MAX_EXPONENT - 2) {
        throw new ToolException(ErrorCode.OVERFLOW, "the result is too small (|x| must stay at or above 1e-" + MAX_EXPONENT + ")");
      }
    }
    BigDecimal raised = (long) base.precision() * magnitude <= EXACT_POWER_DIGITS
        ? base.pow(magnitude)
        : base.pow(magnitude, WIDE);
    BigDecimal result = n < 0 ? BigDecimal.ONE.divide(raised, CONTEXT) : raised.round(CONTEXT);
    return checked(result);
  }

  /**
   * The square root correctly rounded to 34 digits, ties to even: computed on integers with
   * {@link BigInteger#sqrt()}, so the result is the same on every JVM.
   */
  static BigDecimal sqrt(BigDecimal x) throws ToolException {
    if (x.signum() < 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "square root of a negative number");
    }
    if (x.signum() == 0) {
      return BigDecimal.ZERO;
    }
    // Write x = m * 10^(-2k) with m an integer of at least 2*(34+2) digits.
    int k = Math.max(0, (2 * (CONTEXT.getPrecision() + 2) - x.precision() + 1) / 2 + 1);
    int scale2 = x.scale() + 2 * k;
    if ((scale2 & 1) != 0) {
      scale2++;
      k++;
    }
    BigInteger m = x.movePointRight(scale2).toBigIntegerExact();
    BigInteger root = m.sqrt();
    boolean exact = root.multiply(root).equals(m);
    BigDecimal truncated = new BigDecimal(root, scale2 / 2);
    if (exact) {
      return checked(truncated.round(CONTEXT));
    }
    // Inexact: the true root lies strictly above `truncated`; a sticky digit keeps ties honest.
    BigDecimal sticky = new BigDecimal(root.multiply(BigInteger.TEN).add(BigInteger.ONE), scale2 / 2 + 1);
    return checked(sticky.round(CONTEXT));
  }

  /** A double result as its exact decimal value, rounded to 34 digits; NaN and infinity are errors. */
  static BigDecimal fromDouble(double d, String what) throws ToolException {
    if (Double.isNaN(d)) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, what + " is undefined for this argument");
    }
    if (Double.isInfinite(d)) {
      throw new ToolException(ErrorCode.OVERFLOW, what + " overflows");
    }
    return checked(new BigDecimal(d).round(CONTEXT));
  }

  static boolean isWhole(BigDecimal x) {
    return x.signum() == 0 || x.stripTrailingZeros().scale() <= 0;
  }

  private static String shortText(BigDecimal x) {
    String s = x.toString();
    return s.length() <= 24 ? s : s.substring(0, 20) + "…";
  }
}
