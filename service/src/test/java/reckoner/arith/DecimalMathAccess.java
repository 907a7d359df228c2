package reckoner.arith;

import java.math.BigDecimal;
import reckoner.tool.ToolException;

/** Test access to the package-private decimal math. */
final class DecimalMathAccess {
  private DecimalMathAccess() {}

  static BigDecimal sqrt(String x) throws ToolException {
    return DecimalMath.sqrt(new BigDecimal(x));
  }
}
