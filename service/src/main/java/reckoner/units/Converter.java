package reckoner.units;

import java.util.Set;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolException;

/**
 * Converts an exact value between two parsed units: linearly when the dimensions agree; affinely
 * when one side is a temperature scale with an offset (°C, °F); and as a reciprocal for the two
 * customary inverse pairs, fuel consumption and fuel economy (L/100km and mpg: volume per length
 * against length per volume) and pace and speed (min/km and km/h). The result stays exact.
 */
final class Converter {
  /** The dimensions between which a reciprocal conversion is customary, each with its inverse. */
  private static final Set<Dimension> RECIPROCAL = Set.of(
      Dimension.parse("L2"), Dimension.parse("L-2"), Dimension.parse("L-1 T"), Dimension.parse("L T-1"));

  private Converter() {}

  /** {@code value} in {@code from}, expressed in {@code to}; the texts are for messages only. */
  static Factor convert(Rational value, Unit from, String fromText, Unit to, String toText) throws ToolException {
    if (from.dimension().equals(to.dimension())) {
      if (from.hasOffset() || to.hasOffset()) {
        return affine(value, from, fromText, to, toText);
      }
      return Factor.of(value).times(from.factor()).divide(to.factor());
    }
    if (from.dimension().times(to.dimension()).isNone() && RECIPROCAL.contains(from.dimension())) {
      if (value.isZero()) {
        throw new ToolException(ErrorCode.DOMAIN_ERROR, "0 " + clip(fromText) + " has no reciprocal in "
            + clip(toText) + "; the conversion between " + DimensionNames.describe(from.dimension()) + " and "
            + DimensionNames.describe(to.dimension()) + " divides by the value");
      }
      return Factor.of(value).times(from.factor()).times(to.factor()).reciprocal();
    }
    throw mismatch(from, fromText, to, toText);
  }

  private static Factor affine(Rational value, Unit from, String fromText, Unit to, String toText)
      throws ToolException {
    if (from.interval() || to.interval()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "cannot convert between a temperature on a scale and a"
          + " temperature difference ('" + clip(fromText) + "' to '" + clip(toText) + "'); convert differences"
          + " with K, Δ°C or Δ°F on both sides");
    }
    // Both factors are rational: temperature rows never involve pi.
    Rational kelvin = value.plus(from.offset()).times(from.factor().coefficient());
    return Factor.of(kelvin.divide(to.factor().coefficient()).minus(to.offset()));
  }

  private static ToolException mismatch(Unit from, String fromText, Unit to, String toText) {
    String detail = "cannot convert " + DimensionNames.describe(from.dimension()) + " to "
        + DimensionNames.describe(to.dimension()) + " ('" + clip(fromText) + "' to '" + clip(toText) + "')";
    Dimension temperature = Dimension.of(Dimension.Base.TEMPERATURE);
    boolean looksLikeTemperature = isCOrF(fromText) || isCOrF(toText);
    if (looksLikeTemperature && (from.dimension().equals(temperature) || to.dimension().equals(temperature)
        || isCOrF(fromText) && isCOrF(toText))) {
      detail += "; C is the coulomb and F the farad: write °C or degC, °F or degF for temperatures";
    }
    return new ToolException(ErrorCode.DIMENSION_MISMATCH, detail);
  }

  private static boolean isCOrF(String text) {
    String t = text.strip();
    return t.equals("C") || t.equals("F");
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }
}
