package reckoner.units;

import java.util.Arrays;
import java.util.Locale;

/**
 * A physical dimension: whole exponents over the seven SI base quantities (SI Brochure, 9th
 * edition, Table 3) plus plane angle and information, which this table keeps as dimensions of
 * their own so that rad/s and Hz, or bit and 1, are never confused. Immutable.
 */
final class Dimension {
  /** The base quantities, in the order a dimension formula lists them. */
  enum Base {
    LENGTH("length", "L"),
    MASS("mass", "M"),
    TIME("time", "T"),
    CURRENT("electric current", "I"),
    TEMPERATURE("temperature", "Θ"),
    AMOUNT("amount of substance", "N"),
    LUMINOUS_INTENSITY("luminous intensity", "J"),
    ANGLE("angle", "A"),
    INFORMATION("information", "D");

    final String word;
    final String letter;

    Base(String word, String letter) {
      this.word = word;
      this.letter = letter;
    }
  }

  private static final int COUNT = Base.values().length;
  static final Dimension NONE = new Dimension(new int[COUNT]);

  private final int[] exponents;

  private Dimension(int[] exponents) {
    this.exponents = exponents;
  }

  static Dimension of(Base base) {
    int[] e = new int[COUNT];
    e[base.ordinal()] = 1;
    return new Dimension(e);
  }

  /**
   * Parses a formula of base letters with optional exponents separated by spaces, such as
   * {@code L2 M T-2}; {@code 1} is the dimensionless. Throws IllegalArgumentException otherwise.
   */
  static Dimension parse(String formula) {
    int[] e = new int[COUNT];
    if (formula.equals("1")) {
      return NONE;
    }
    for (String part : formula.trim().split(" +")) {
      Base base = null;
      for (Base b : Base.values()) {
        if (part.startsWith(b.letter)) {
          base = b;
        }
      }
      if (base == null) {
        throw new IllegalArgumentException("not a dimension formula: " + formula);
      }
      String exp = part.substring(base.letter.length());
      e[base.ordinal()] += exp.isEmpty() ? 1 : Integer.parseInt(exp);
    }
    return new Dimension(e);
  }

  int exponent(Base base) {
    return exponents[base.ordinal()];
  }

  /** The largest absolute exponent, used to bound absurd compounds. */
  int maxAbsExponent() {
    int max = 0;
    for (int x : exponents) {
      max = Math.max(max, Math.abs(x));
    }
    return max;
  }

  boolean isNone() {
    return equals(NONE);
  }

  Dimension times(Dimension other) {
    int[] e = new int[COUNT];
    for (int i = 0; i < COUNT; i++) {
      e[i] = exponents[i] + other.exponents[i];
    }
    return new Dimension(e);
  }

  Dimension divide(Dimension other) {
    return times(other.pow(-1));
  }

  Dimension pow(int power) {
    int[] e = new int[COUNT];
    for (int i = 0; i < COUNT; i++) {
      e[i] = exponents[i] * power;
    }
    return new Dimension(e);
  }

  /** The formula in base words, e.g. {@code length^2·mass·time^-3}; {@code dimensionless} for none. */
  String formulaInWords() {
    StringBuilder sb = new StringBuilder();
    for (Base b : Base.values()) {
      int x = exponents[b.ordinal()];
      if (x != 0) {
        if (sb.length() > 0) {
          sb.append('·');
        }
        sb.append(b.word);
        if (x != 1) {
          sb.append('^').append(x);
        }
      }
    }
    return sb.length() == 0 ? "dimensionless" : sb.toString();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Dimension d && Arrays.equals(exponents, d.exponents);
  }

  @Override
  public int hashCode() {
    return Arrays.hashCode(exponents);
  }

  /** The formula in letters, e.g. {@code L2 M T-2}; {@code 1} for none. Reads like {@link #parse}'s input. */
  @Override
  public String toString() {
    StringBuilder sb = new StringBuilder();
    for (Base b : Base.values()) {
      int x = exponents[b.ordinal()];
      if (x != 0) {
        if (sb.length() > 0) {
          sb.append(' ');
        }
        sb.append(b.letter);
        if (x != 1) {
          sb.append(String.format(Locale.ROOT, "%d", x));
        }
      }
    }
    return sb.length() == 0 ? "1" : sb.toString();
  }
}
