package reckoner.arith;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import reckoner.arith.Node.Fn;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * arith@2's functions of exact values. Roots, abs, floor, ceil, trunc, max, min, rem, gcd, lcm,
 * factorials and binomials are exact (roots correctly rounded to 34 digits when irrational). The
 * transcendental functions round their argument to 34 significant digits and run arith@1's
 * binary64 {@link Functions} (StrictMath), whose result, rounded to 34 digits, is then exact;
 * logarithms of exact powers of their base are exact whole numbers, as are the sine, cosine and
 * tangent of multiples of 30 and 45 degrees where those are rational. Pure functions.
 */
final class RealFunctions {
  static final BigDecimal PI = new BigDecimal("3.14159265358979323846264338327950288419716939937510582097494");
  static final BigDecimal E = new BigDecimal("2.71828182845904523536028747135266249775724709369995957496697");
  static final int MAX_FACTORIAL = 3000;
  static final int MAX_BINOMIAL = 10_000;
  static final int MAX_POWER = 100_000;
  private static final MathContext DIGITS_34 = MathContext.DECIMAL128;

  private RealFunctions() {}

  static Rational constant(String name) {
    return Rational.of(name.equals("pi") ? PI : E);
  }

  /** A function of exact arguments. */
  static Rational apply(Fn fn, List<Rational> args) throws ToolException, Rational.TooLarge {
    Rational x = args.get(0);
    switch (fn) {
      case SQRT:
        return Roots.root(x, 2);
      case CBRT:
        return Roots.root(x, 3);
      case ROOT:
        return Roots.root(x, degree(args.get(1)));
      case ABS:
        return x.abs();
      case FLOOR:
        return Rational.of(floor(x));
      case CEIL:
        return Rational.of(floor(x.negate()).negate());
      case TRUNC:
        return x.signum() < 0 ? Rational.of(floor(x.negate()).negate()) : Rational.of(floor(x));
      case MAX:
      case MIN: {
        Rational best = x;
        for (Rational a : args) {
          int c = a.compareTo(best);
          if (fn == Fn.MAX ? c > 0 : c < 0) {
            best = a;
          }
        }
        return best;
      }
      case REM:
        return x.remainder(args.get(1), false);
      case GCD:
      case LCM:
        return gcdOrLcm(fn, args);
      case LOG_BASE:
        return logBase(x, args.get(1));
      case LOG10: {
        Optional<Rational> k = x.signum() > 0 ? exactLogarithm(x, Rational.of(10)) : Optional.empty();
        return k.isPresent() ? k.get() : binary("log10", x);
      }
      case LOG2: {
        Optional<Rational> k = x.signum() > 0 ? exactLogarithm(x, Rational.of(2)) : Optional.empty();
        return k.isPresent() ? k.get() : binary("log2", x);
      }
      case LN:
        return binary("ln", x);
      case EXP:
        return binary("exp", x);
      case SIN:
        return binary("sin", x);
      case COS:
        return binary("cos", x);
      case TAN:
        return binary("tan", x);
      case ASIN:
        return binary("asin", x);
      case ACOS:
        return binary("acos", x);
      case ATAN:
        return binary("atan", x);
      default:
        throw new IllegalStateException("unhandled function " + fn);
    }
  }

  /** A transcendental function: argument to 34 digits, binary64 through arith@1's functions. */
  static Rational binary(String name, Rational x) throws ToolException {
    return binary(name, x.round(DIGITS_34));
  }

  static Rational binary(String name, BigDecimal x34) throws ToolException {
    return Rational.of(Functions.apply(name, x34));
  }

  /** sin, cos or tan of an exact angle in degrees; exact at the rational values of multiples of 30 and 45. */
  static Rational trigDegrees(Fn fn, Rational degrees) throws ToolException, Rational.TooLarge {
    Rational r = degrees.remainder(Rational.of(360), true);
    if (r.isInteger()) {
      int d = r.toInteger().intValueExact();
      Optional<Rational> special = special(fn, d);
      if (special.isPresent()) {
        return special.get();
      }
      if (fn == Fn.TAN && (d == 90 || d == 270)) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "tan is undefined at " + d + " degrees");
      }
    }
    Rational radians = degrees.multiply(constant("pi")).divide(Rational.of(180));
    return binary(fn.wireName, radians);
  }

  private static final Map<Integer, Integer> SIN_HALVES = Map.of(0, 0, 30, 1, 90, 2, 150, 1, 180, 0, 210, -1, 270, -2, 330, -1);
  private static final Map<Integer, Integer> TAN_UNITS = Map.of(0, 0, 45, 1, 135, -1, 180, 0, 225, 1, 315, -1);

  private static Optional<Rational> special(Fn fn, int d) {
    Integer halves = switch (fn) {
      case SIN -> SIN_HALVES.get(d);
      case COS -> SIN_HALVES.get(Math.floorMod(90 - d, 360));
      default -> null;
    };
    if (halves != null) {
      return Optional.of(halves % 2 == 0 ? Rational.of(halves / 2) : new Rational(BigInteger.valueOf(halves), BigInteger.TWO));
    }
    if (fn == Fn.TAN && TAN_UNITS.containsKey(d)) {
      return Optional.of(Rational.of(TAN_UNITS.get(d)));
    }
    return Optional.empty();
  }

  /** {@code base ^ exponent}: exact for whole exponents and for rational ones whose root is exact. */
  static Rational power(Rational base, Rational exponent, boolean baseIsE) throws ToolException, Rational.TooLarge {
    if (exponent.isInteger()) {
      BigInteger n = exponent.toInteger();
      if (n.abs().compareTo(BigInteger.valueOf(MAX_POWER)) > 0) {
        if (base.abs().compareTo(Rational.ONE) == 0) {
          return n.testBit(0) ? base : Rational.ONE;
        }
        if (base.signum() == 0) {
          if (n.signum() < 0) {
            throw new ToolException(ErrorCode.DOMAIN_ERROR, "zero raised to a negative power");
          }
          return Rational.ZERO;
        }
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED,
            "the exponent " + shortText(n.toString()) + " exceeds the limit of ±" + MAX_POWER);
      }
      return base.pow(n.intValueExact());
    }
    if (base.signum() == 0) {
      if (exponent.signum() < 0) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "zero raised to a negative power");
      }
      return Rational.ZERO;
    }
    if (base.signum() < 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "a negative number raised to a fractional power"
          + " (for an odd root of a negative number write cbrt(x) or root(x, n))");
    }
    if (exponent.den().compareTo(BigInteger.valueOf(Roots.MAX_DEGREE)) <= 0
        && exponent.num().abs().compareTo(BigInteger.valueOf(MAX_POWER)) <= 0) {
      Optional<Rational> root = Roots.exactRoot(base, exponent.den().intValueExact());
      if (root.isPresent()) {
        return root.get().pow(exponent.num().intValueExact());
      }
    }
    if (baseIsE) {
      return binary("exp", exponent);
    }
    return fractionalPower(base.round(DIGITS_34), exponent.round(DIGITS_34));
  }

  /** x^y in binary64 for x > 0, through logarithms when x is beyond a double's range. */
  static Rational fractionalPower(BigDecimal x, BigDecimal y) throws ToolException {
    double base = x.doubleValue();
    double exp = y.doubleValue();
    if (base > 0 && Double.isFinite(base) && Math.abs(DecimalMath.exponentOf(x)) < 300) {
      double r = StrictMath.pow(base, exp);
      if (r != 0 && Double.isFinite(r)) {
        return Rational.of(DecimalMath.fromDouble(r, "power"));
      }
    }
    // x^y = 10^(y * log10 x), split into a whole power of ten and a mantissa.
    int k = DecimalMath.exponentOf(x);
    double log10 = (StrictMath.log10(x.movePointLeft(k).doubleValue()) + k) * exp;
    if (!Double.isFinite(log10) || log10 > Rational.MAX_EXPONENT + 1) {
      throw Rational.tooLargeResult();
    }
    if (log10 < -Rational.MAX_EXPONENT - 1) {
      throw Rational.tooSmallResult();
    }
    double whole = Math.floor(log10);
    BigDecimal mantissa = DecimalMath.fromDouble(StrictMath.pow(10.0, log10 - whole), "power");
    return Rational.of(mantissa.scaleByPowerOfTen((int) whole)).checked();
  }

  /** log_base(x): a whole number when x is an exact power of the base, binary64 otherwise. */
  static Rational logBase(Rational x, Rational base) throws ToolException {
    if (x.signum() <= 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "a logarithm is defined only for positive numbers");
    }
    if (base.signum() <= 0 || base.compareTo(Rational.ONE) == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "the base of a logarithm must be positive and not 1");
    }
    Optional<Rational> k = exactLogarithm(x, base);
    if (k.isPresent()) {
      return k.get();
    }
    double lnX = Functions.apply("ln", x.round(DIGITS_34)).doubleValue();
    double lnB = Functions.apply("ln", base.round(DIGITS_34)).doubleValue();
    return Rational.of(DecimalMath.fromDouble(lnX / lnB, "log"));
  }

  /** The whole k with base^k = x exactly, if there is one within the limits; x, base > 0, base != 1. */
  static Optional<Rational> exactLogarithm(Rational x, Rational base) {
    double estimate = x.log10Abs() / base.log10Abs();
    long k = Math.round(estimate);
    if (Math.abs(estimate - k) > 1e-6 || Math.abs(k) > MAX_POWER) {
      return Optional.empty();
    }
    try {
      return base.pow((int) k).compareTo(x) == 0 ? Optional.of(Rational.of(k)) : Optional.empty();
    } catch (Rational.TooLarge | ToolException e) {
      return Optional.empty(); // not representable exactly: the caller computes in binary64
    }
  }

  static Rational factorial(Rational x) throws ToolException {
    if (!x.isInteger() || x.signum() < 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "a factorial is defined here only for whole numbers from 0");
    }
    BigInteger n = x.toInteger();
    if (n.compareTo(BigInteger.valueOf(MAX_FACTORIAL)) > 0) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the factorial of " + shortText(n.toString())
          + " exceeds the limit (n! for n up to " + MAX_FACTORIAL + ")");
    }
    return Rational.of(product(1, n.intValueExact()));
  }

  /** The product of lo..hi, split in halves so the multiplications stay balanced. */
  private static BigInteger product(int lo, int hi) {
    if (lo > hi) {
      return BigInteger.ONE;
    }
    if (hi - lo < 16) {
      BigInteger p = BigInteger.valueOf(lo);
      for (int i = lo + 1; i <= hi; i++) {
        p = p.multiply(BigInteger.valueOf(i));
      }
      return p;
    }
    int mid = (lo + hi) >>> 1;
    return product(lo, mid).multiply(product(mid + 1, hi));
  }

  /** n choose k for whole n >= 0; 0 when k < 0 or k > n. */
  static Rational choose(Rational n, Rational k) throws ToolException {
    if (!n.isInteger() || !k.isInteger() || n.signum() < 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "n choose k is defined here only for whole n >= 0 and whole k");
    }
    BigInteger bn = n.toInteger();
    BigInteger bk = k.toInteger();
    if (bn.compareTo(BigInteger.valueOf(MAX_BINOMIAL)) > 0) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "n choose k is limited to n up to " + MAX_BINOMIAL);
    }
    if (bk.signum() < 0 || bk.compareTo(bn) > 0) {
      return Rational.ZERO;
    }
    int nn = bn.intValueExact();
    int kk = Math.min(bk.intValueExact(), nn - bk.intValueExact());
    return Rational.of(product(nn - kk + 1, nn).divide(product(1, kk)));
  }

  private static Rational gcdOrLcm(Fn fn, List<Rational> args) throws ToolException {
    BigInteger acc = null;
    for (Rational a : args) {
      if (!a.isInteger()) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, fn.wireName + " is defined only for whole numbers");
      }
      BigInteger v = a.toInteger().abs();
      if (acc == null) {
        acc = v;
      } else if (fn == Fn.GCD) {
        acc = acc.gcd(v);
      } else {
        acc = acc.signum() == 0 || v.signum() == 0 ? BigInteger.ZERO : acc.divide(acc.gcd(v)).multiply(v);
        if (acc.bitLength() > Rational.MAX_BITS) {
          throw Rational.tooLargeResult();
        }
      }
    }
    return Rational.of(acc).checked();
  }

  private static BigInteger floor(Rational x) {
    BigInteger[] qr = x.num().divideAndRemainder(x.den());
    return qr[1].signum() < 0 ? qr[0].subtract(BigInteger.ONE) : qr[0];
  }

  static int degree(Rational n) throws ToolException {
    if (!n.isInteger() || n.toInteger().compareTo(BigInteger.ONE) < 0
        || n.toInteger().compareTo(BigInteger.valueOf(Roots.MAX_DEGREE)) > 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "the degree of a root must be a whole number from 1 to " + Roots.MAX_DEGREE);
    }
    return n.toInteger().intValueExact();
  }

  private static String shortText(String s) {
    return s.length() <= 24 ? s : s.substring(0, 20) + "…";
  }
}
