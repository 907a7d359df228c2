package reckoner.arith;

import java.math.BigDecimal;
import java.math.RoundingMode;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * The named functions. {@code sqrt}, {@code abs}, {@code floor} and {@code ceil} are decimal and
 * exact (sqrt correctly rounded to 34 digits); the others are binary64 through {@link StrictMath},
 * angles in radians.
 */
final class Functions {
  private static final double LN2 = StrictMath.log(2.0);
  private static final double LN10 = StrictMath.log(10.0);

  private Functions() {}

  static BigDecimal apply(String name, BigDecimal x) throws ToolException {
    return switch (name) {
      case "sqrt" -> DecimalMath.sqrt(x);
      case "abs" -> x.abs();
      case "floor" -> x.setScale(0, RoundingMode.FLOOR);
      case "ceil" -> x.setScale(0, RoundingMode.CEILING);
      case "cbrt" -> binary(name, StrictMath.cbrt(x.doubleValue()));
      case "exp" -> binary(name, StrictMath.exp(x.doubleValue()));
      case "ln", "log" -> binary(name, ln(positive(name, x)));
      case "log10" -> binary(name, log10(positive(name, x)));
      case "log2" -> binary(name, log2(positive(name, x)));
      case "sin" -> binary(name, StrictMath.sin(x.doubleValue()));
      case "cos" -> binary(name, StrictMath.cos(x.doubleValue()));
      case "tan" -> binary(name, StrictMath.tan(x.doubleValue()));
      case "asin" -> binary(name, StrictMath.asin(unit(name, x)));
      case "acos" -> binary(name, StrictMath.acos(unit(name, x)));
      case "atan" -> binary(name, StrictMath.atan(x.doubleValue()));
      default -> throw new ToolException(ErrorCode.SYNTAX_ERROR, "unknown function '" + name + "'");
    };
  }

  private static BigDecimal binary(String name, double result) throws ToolException {
    return DecimalMath.fromDouble(result, name);
  }

  private static BigDecimal positive(String name, BigDecimal x) throws ToolException {
    if (x.signum() <= 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, name + " is defined only for positive numbers");
    }
    return x;
  }

  // Logarithms split x = m * 10^k with m in [1, 10), so the whole decimal range has a logarithm
  // (a double cannot hold 1e-9999) and exact powers of ten give whole numbers.
  private static double ln(BigDecimal x) {
    int k = DecimalMath.exponentOf(x);
    return StrictMath.log(x.movePointLeft(k).doubleValue()) + k * LN10;
  }

  private static double log10(BigDecimal x) {
    int k = DecimalMath.exponentOf(x);
    return StrictMath.log10(x.movePointLeft(k).doubleValue()) + k;
  }

  /** Exact for powers of two: the binary exponent is split off before the logarithm. */
  private static double log2(BigDecimal x) {
    int k = DecimalMath.exponentOf(x);
    if (Math.abs(k) > 300) {
      return ln(x) / LN2;
    }
    double d = x.doubleValue();
    int binaryExponent = Math.getExponent(d);
    return binaryExponent + StrictMath.log(Math.scalb(d, -binaryExponent)) / LN2;
  }

  private static double unit(String name, BigDecimal x) throws ToolException {
    if (x.abs().compareTo(BigDecimal.ONE) > 0) {
      throw new ToolException(ErrorCode.DOMAIN_ERROR, name + " is defined only for -1 <= x <= 1");
    }
    return x.doubleValue();
  }
}
