package reckoner.arith;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import reckoner.arith.Node.Fn;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Evaluates a tree whose exact values outgrow the exact evaluator (such as (1 + 0.05/365)^10950),
 * on intervals: every operation rounds its lower bound down and its upper bound up at a working
 * precision, so the exact value always lies between the bounds. The final rounding is accepted
 * only when both bounds round to the same result, which is then the correctly rounded exact
 * value; otherwise the caller retries at a higher precision ({@link Undecided}). Functions see the
 * same argument as in exact evaluation (rounded to 34 digits) or are undecided. One instance
 * evaluates at one precision; immutable.
 */
final class BoundedEvaluator {
  /** The bounds are too far apart to decide a step (or the final rounding) at this precision. */
  static final class Undecided extends Exception {
    private static final long serialVersionUID = 1L;

    Undecided() {
      super(null, null, false, false);
    }
  }

  /** An interval {@code lo <= x <= hi}. */
  record Bounds(BigDecimal lo, BigDecimal hi) {
    boolean isPoint() {
      return lo.compareTo(hi) == 0;
    }

    int signum() {
      return lo.signum() > 0 ? 1 : hi.signum() < 0 ? -1 : 0;
    }
  }

  private static final BigDecimal LIMIT = BigDecimal.ONE.scaleByPowerOfTen(Rational.MAX_EXPONENT + 1);
  private static final BigDecimal FLOOR = BigDecimal.ONE.scaleByPowerOfTen(-Rational.MAX_EXPONENT);
  private static final MathContext DIGITS_34 = MathContext.DECIMAL128;
  private static final BigDecimal HUNDREDTH = new BigDecimal("0.01");

  private final MathContext down;
  private final MathContext up;

  BoundedEvaluator(int precision) {
    this.down = new MathContext(precision, RoundingMode.FLOOR);
    this.up = new MathContext(precision, RoundingMode.CEILING);
  }

  Bounds evaluate(Node node) throws ToolException, Undecided {
    if (node instanceof Node.Num n) {
      return of(n.value());
    }
    if (node instanceof Node.Const c) {
      return of(c.name().equals("pi") ? RealFunctions.PI : RealFunctions.E);
    }
    if (node instanceof Node.Neg n) {
      return negate(evaluate(n.x()));
    }
    if (node instanceof Node.Bin b) {
      return binary(b);
    }
    if (node instanceof Node.Percent p) {
      Bounds x = evaluate(p.x());
      return checked(new Bounds(x.lo().multiply(HUNDREDTH), x.hi().multiply(HUNDREDTH)));
    }
    if (node instanceof Node.PercentChange p) {
      Bounds base = evaluate(p.base());
      Bounds pct = evaluate(p.percent());
      Bounds change = multiply(base, new Bounds(pct.lo().multiply(HUNDREDTH), pct.hi().multiply(HUNDREDTH)));
      return p.increase() ? add(base, change) : add(base, negate(change));
    }
    if (node instanceof Node.Factorial f) {
      return of(RealFunctions.factorial(point(evaluate(f.x()))));
    }
    if (node instanceof Node.Degrees d) {
      return radians(evaluate(d.x()));
    }
    if (node instanceof Node.Call c) {
      return call(c);
    }
    throw new IllegalStateException("unknown node " + node);
  }

  private Bounds binary(Node.Bin b) throws ToolException, Undecided {
    Bounds l = evaluate(b.left());
    Bounds r = evaluate(b.right());
    switch (b.op()) {
      case ADD:
        return add(l, r);
      case SUB:
        return add(l, negate(r));
      case MUL:
        return multiply(l, r);
      case DIV:
        return divide(l, r);
      case MOD:
        return remainder(l, r, true);
      case CHOOSE:
        return of(RealFunctions.choose(point(l), point(r)));
      case POW:
        return power(l, r, b.left() instanceof Node.Const c && c.name().equals("e"));
      default:
        throw new IllegalStateException("unknown operator " + b.op());
    }
  }

  // ---- interval arithmetic ----

  private Bounds of(BigDecimal exact) {
    return new Bounds(exact.round(down), exact.round(up));
  }

  private Bounds of(Rational exact) {
    return new Bounds(exact.round(down), exact.round(up));
  }

  private static Bounds negate(Bounds x) {
    return new Bounds(x.hi().negate(), x.lo().negate());
  }

  private Bounds add(Bounds a, Bounds b) throws ToolException, Undecided {
    return checked(new Bounds(a.lo().add(b.lo(), down), a.hi().add(b.hi(), up)));
  }

  private Bounds multiply(Bounds a, Bounds b) throws ToolException, Undecided {
    if (a.lo().signum() >= 0 && b.lo().signum() >= 0) {
      return checked(new Bounds(a.lo().multiply(b.lo(), down), a.hi().multiply(b.hi(), up)));
    }
    BigDecimal[] ends = {a.lo(), a.hi()};
    BigDecimal[] others = {b.lo(), b.hi()};
    BigDecimal lo = null;
    BigDecimal hi = null;
    for (BigDecimal x : ends) {
      for (BigDecimal y : others) {
        BigDecimal d = x.multiply(y, down);
        BigDecimal u = x.multiply(y, up);
        lo = lo == null || d.compareTo(lo) < 0 ? d : lo;
        hi = hi == null || u.compareTo(hi) > 0 ? u : hi;
      }
    }
    return new Bounds(lo, hi);
  }

  private Bounds divide(Bounds a, Bounds b) throws ToolException, Undecided {
    if (b.signum() == 0) {
      if (b.isPoint()) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "division by zero");
      }
      throw new Undecided();
    }
    return checked(quotient(a, b));
  }

  /** a / b for b not containing zero, without the range check. */
  private Bounds quotient(Bounds a, Bounds b) {
    if (a.isPoint() && a.lo().signum() == 0) {
      return a;
    }
    if (b.isPoint() && b.lo().abs().compareTo(BigDecimal.ONE) == 0) {
      return b.lo().signum() > 0 ? a : negate(a);
    }
    BigDecimal[] ends = {a.lo(), a.hi()};
    BigDecimal[] others = {b.lo(), b.hi()};
    BigDecimal lo = null;
    BigDecimal hi = null;
    for (BigDecimal x : ends) {
      for (BigDecimal y : others) {
        BigDecimal d = x.divide(y, down);
        BigDecimal u = x.divide(y, up);
        lo = lo == null || d.compareTo(lo) < 0 ? d : lo;
        hi = hi == null || u.compareTo(hi) > 0 ? u : hi;
      }
    }
    return new Bounds(lo, hi);
  }

  /** a - b * q with q the floored or truncated quotient, when q is the same across the bounds. */
  private Bounds remainder(Bounds a, Bounds b, boolean floor) throws ToolException, Undecided {
    if (b.isPoint() && b.lo().signum() == 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, "modulo by zero");
    }
    if (b.signum() == 0) {
      throw new Undecided();
    }
    Bounds q = quotient(a, b); // not a value of the expression: no range check
    RoundingMode mode = floor ? RoundingMode.FLOOR : RoundingMode.DOWN;
    BigDecimal qLo = q.lo().setScale(0, mode);
    BigDecimal qHi = q.hi().setScale(0, mode);
    if (qLo.compareTo(qHi) != 0) {
      throw new Undecided();
    }
    return add(a, negate(multiply(b, new Bounds(qLo, qLo))));
  }

  private Bounds power(Bounds base, Bounds exponent, boolean baseIsE) throws ToolException, Undecided {
    if (base.isPoint() && exponent.isPoint()) {
      try {
        Rational b = Rational.of(base.lo());
        Rational e = Rational.of(exponent.lo());
        if (!e.isInteger() || e.toInteger().abs().compareTo(BigInteger.valueOf(RealFunctions.MAX_POWER)) > 0) {
          return of(RealFunctions.power(b, e, baseIsE));
        }
      } catch (Rational.TooLarge e) {
        // a fractional power of a huge base: fall through
      }
    }
    if (!exponent.isPoint() || exponent.lo().stripTrailingZeros().scale() > 0) {
      BigDecimal e34 = agreed(exponent);
      if (e34.signum() == 0 || e34.stripTrailingZeros().scale() <= 0) {
        throw new Undecided(); // whole or fractional: not known from the bounds
      }
      BigDecimal b34 = agreed(base);
      try {
        return of(RealFunctions.power(Rational.of(b34), Rational.of(e34), baseIsE));
      } catch (Rational.TooLarge e) {
        throw new Undecided();
      }
    }
    BigInteger n = exponent.lo().toBigIntegerExact();
    if (n.abs().compareTo(BigInteger.valueOf(RealFunctions.MAX_POWER)) > 0) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the exponent " + shortText(n.toString())
          + " exceeds the limit of ±" + RealFunctions.MAX_POWER);
    }
    int m = Math.abs(n.intValueExact());
    if (m == 0) {
      return new Bounds(BigDecimal.ONE, BigDecimal.ONE);
    }
    if (base.isPoint() && base.lo().signum() == 0) {
      if (n.signum() < 0) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "zero raised to a negative power");
      }
      return base;
    }
    Bounds result = null;
    Bounds square = base;
    while (true) {
      if ((m & 1) != 0) {
        result = result == null ? square : multiply(result, square);
      }
      m >>>= 1;
      if (m == 0) {
        break;
      }
      square = even(multiply(square, square));
    }
    return n.signum() > 0 ? result : divide(new Bounds(BigDecimal.ONE, BigDecimal.ONE), result);
  }

  /** A square is never negative: clip the lower bound at zero. */
  private static Bounds even(Bounds x) {
    return x.lo().signum() < 0 ? new Bounds(BigDecimal.ZERO, x.hi()) : x;
  }

  private Bounds radians(Bounds degrees) throws ToolException, Undecided {
    return divide(multiply(degrees, of(RealFunctions.PI)), new Bounds(BigDecimal.valueOf(180), BigDecimal.valueOf(180)));
  }

  private Bounds call(Node.Call c) throws ToolException, Undecided {
    Fn fn = c.fn();
    Node degrees = fn.isTrigonometric() ? Node.Degrees.amount(c.args().get(0)) : null;
    if (degrees != null) {
      Bounds deg = evaluate(degrees);
      if (deg.isPoint()) {
        try {
          return of(RealFunctions.trigDegrees(fn, Rational.of(deg.lo())));
        } catch (Rational.TooLarge e) {
          throw new Undecided();
        }
      }
      return of(RealFunctions.binary(fn.wireName, agreed(radians(deg))));
    }
    List<Bounds> args = new ArrayList<>(c.args().size());
    boolean points = true;
    for (Node a : c.args()) {
      Bounds b = evaluate(a);
      args.add(b);
      points &= b.isPoint();
    }
    if (points) {
      List<Rational> exact = new ArrayList<>(args.size());
      for (Bounds b : args) {
        exact.add(Rational.of(b.lo()));
      }
      try {
        return of(RealFunctions.apply(fn, exact));
      } catch (Rational.TooLarge e) {
        throw new Undecided();
      }
    }
    Bounds x = args.get(0);
    switch (fn) {
      case ABS:
        return x.signum() >= 0 && x.lo().signum() >= 0 ? x : x.hi().signum() <= 0 ? negate(x)
            : new Bounds(BigDecimal.ZERO, x.hi().max(x.lo().negate()));
      case MAX:
      case MIN: {
        BigDecimal lo = x.lo();
        BigDecimal hi = x.hi();
        for (Bounds b : args) {
          lo = fn == Fn.MAX ? lo.max(b.lo()) : lo.min(b.lo());
          hi = fn == Fn.MAX ? hi.max(b.hi()) : hi.min(b.hi());
        }
        return new Bounds(lo, hi);
      }
      case FLOOR:
        return agreedScale(x, RoundingMode.FLOOR);
      case CEIL:
        return agreedScale(x, RoundingMode.CEILING);
      case TRUNC:
        return agreedScale(x, RoundingMode.DOWN);
      case SQRT:
        return root(x, 2);
      case CBRT:
        return root(x, 3);
      case ROOT:
        return root(x, RealFunctions.degree(point(args.get(1))));
      case EXP:
      case LN:
      case LOG10:
      case LOG2:
      case SIN:
      case COS:
      case TAN:
      case ASIN:
      case ACOS:
      case ATAN: {
        List<Rational> arg = List.of(Rational.of(agreed(x)));
        try {
          return of(RealFunctions.apply(fn, arg));
        } catch (Rational.TooLarge e) {
          throw new Undecided();
        }
      }
      case LOG_BASE:
        return of(RealFunctions.logBase(Rational.of(agreed(x)), Rational.of(agreed(args.get(1)))));
      default:
        throw new Undecided(); // rem, gcd, lcm need exact arguments
    }
  }

  private Bounds root(Bounds x, int n) throws ToolException, Undecided {
    if (x.signum() == 0) {
      throw new Undecided();
    }
    if (x.signum() < 0) {
      if (n % 2 == 0) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, n == 2 ? "square root of a negative number"
            : "an even root (" + n + ") of a negative number");
      }
      return negate(root(negate(x), n));
    }
    BigDecimal lo = Roots.rounded(Rational.of(x.lo()), n);
    BigDecimal hi = Roots.rounded(Rational.of(x.hi()), n);
    if (lo.compareTo(hi) != 0) {
      throw new Undecided();
    }
    return of(lo);
  }

  /** The argument a function sees: the value rounded to 34 digits, when both bounds agree on it. */
  private static BigDecimal agreed(Bounds x) throws Undecided {
    BigDecimal lo = x.lo().round(DIGITS_34);
    BigDecimal hi = x.hi().round(DIGITS_34);
    if (lo.compareTo(hi) != 0) {
      throw new Undecided();
    }
    return lo;
  }

  private static Bounds agreedScale(Bounds x, RoundingMode mode) throws Undecided {
    BigDecimal lo = x.lo().setScale(0, mode);
    BigDecimal hi = x.hi().setScale(0, mode);
    if (lo.compareTo(hi) != 0) {
      throw new Undecided();
    }
    return new Bounds(lo, lo);
  }

  private static Rational point(Bounds x) throws Undecided {
    if (!x.isPoint()) {
      throw new Undecided();
    }
    return Rational.of(x.lo());
  }

  /** Bounds entirely out of range are an overflow, as in exact evaluation; partly out: undecided. */
  private static Bounds checked(Bounds x) throws ToolException, Undecided {
    BigDecimal lo = x.lo();
    BigDecimal hi = x.hi();
    if (lo.compareTo(LIMIT) >= 0 || hi.compareTo(LIMIT.negate()) <= 0) {
      throw Rational.tooLargeResult();
    }
    if (hi.compareTo(LIMIT) >= 0 || lo.compareTo(LIMIT.negate()) <= 0) {
      throw new Undecided();
    }
    boolean loTiny = lo.signum() != 0 && lo.abs().compareTo(FLOOR) < 0;
    boolean hiTiny = hi.signum() != 0 && hi.abs().compareTo(FLOOR) < 0;
    if (loTiny && hiTiny && lo.signum() == hi.signum()) {
      throw Rational.tooSmallResult();
    }
    if (loTiny || hiTiny) {
      throw new Undecided();
    }
    return x;
  }

  private static String shortText(String s) {
    return s.length() <= 24 ? s : s.substring(0, 20) + "…";
  }
}
