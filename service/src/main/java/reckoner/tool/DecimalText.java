package reckoner.tool;

import java.math.BigDecimal;
import java.math.MathContext;

/**
 * Rounds a decimal and writes it by the contract's number rules, the same for every tool: {@code .}
 * as the decimal point, {@code -} as minus, no grouping, no {@code -0}; plain notation for
 * {@code 1e-6 <= |x| < 1e21}, otherwise {@code d.ddde+N} / {@code d.ddde-N}; trailing zeros trimmed
 * unless padding is asked for. Locale-free and thread-safe.
 */
public final class DecimalText {
  private static final BigDecimal PLAIN_MIN = new BigDecimal("1e-6");
  private static final BigDecimal PLAIN_LIMIT = new BigDecimal("1e21");

  private DecimalText() {}

  /** Rounds {@code value} to {@code places} digits after the point (may be negative: tens, hundreds). */
  public static BigDecimal roundToPlaces(BigDecimal value, int places, Rounding rounding) {
    return value.setScale(places, rounding.mode());
  }

  /** Rounds {@code value} to {@code digits} significant digits (at least 1). */
  public static BigDecimal roundToDigits(BigDecimal value, int digits, Rounding rounding) {
    if (digits < 1) {
      throw new IllegalArgumentException("digits must be at least 1: " + digits);
    }
    BigDecimal r = value.round(new MathContext(digits, rounding.mode()));
    // A value with fewer digits than asked (1.5 at 3 digits) gets the zeros that padding would show.
    return r.precision() < digits ? r.setScale(r.scale() + digits - r.precision()) : r;
  }

  /**
   * Writes an already rounded {@code value}. With {@code pad}, the zeros that the rounding kept
   * (its scale) are written out; otherwise trailing zeros are trimmed.
   */
  public static String format(BigDecimal value, boolean pad) {
    if (value.signum() == 0) {
      return pad && value.scale() > 0 ? "0." + "0".repeat(value.scale()) : "0";
    }
    BigDecimal abs = value.abs();
    BigDecimal shown = pad ? value : value.stripTrailingZeros();
    if (abs.compareTo(PLAIN_MIN) >= 0 && abs.compareTo(PLAIN_LIMIT) < 0) {
      return shown.toPlainString();
    }
    return scientific(shown);
  }

  /** {@code d.ddde+N}: one digit before the point, every significant digit kept. */
  private static String scientific(BigDecimal value) {
    String digits = value.unscaledValue().abs().toString();
    int exponent = digits.length() - 1 - value.scale();
    StringBuilder sb = new StringBuilder(digits.length() + 8);
    if (value.signum() < 0) {
      sb.append('-');
    }
    sb.append(digits.charAt(0));
    if (digits.length() > 1) {
      sb.append('.').append(digits, 1, digits.length());
    }
    return sb.append('e').append(exponent < 0 ? '-' : '+').append(Math.abs(exponent)).toString();
  }
}
