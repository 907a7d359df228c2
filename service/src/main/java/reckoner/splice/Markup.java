package reckoner.splice;

import java.util.Objects;

/**
 * The strings that mark a call inside text: {@code OPEN NAME(INPUT) CLOSE} for a call, answered as
 * {@code OPEN NAME(INPUT) SEPARATOR TEXT CLOSE}. The default is {@code <<arith(1+1)>>}, answered
 * {@code <<arith(1+1) => 2>>}. Each string is 1 to 16 characters of which none is a control
 * character; the three are different and none contains another, so a document parses one way.
 * Immutable.
 */
public record Markup(String open, String separator, String close) {
  public static final Markup DEFAULT = new Markup("<<", " => ", ">>");
  static final int MAX_LENGTH = 16;

  public Markup {
    check("open", open);
    check("separator", separator);
    check("close", close);
    String[][] pairs = {{open, close}, {open, separator}, {close, separator}};
    for (String[] p : pairs) {
      if (p[0].contains(p[1]) || p[1].contains(p[0])) {
        throw new IllegalArgumentException("markup strings must not contain each other: '" + p[0] + "', '" + p[1] + "'");
      }
    }
    if (separator.isBlank()) {
      throw new IllegalArgumentException("the separator must hold a visible character");
    }
  }

  /** The default markup with any of the three strings replaced (null keeps the default). */
  public static Markup of(String open, String separator, String close) {
    return new Markup(open == null ? DEFAULT.open : open, separator == null ? DEFAULT.separator : separator,
        close == null ? DEFAULT.close : close);
  }

  /** Whether {@code text} holds any of the three strings, so it cannot be spliced without ambiguity. */
  public boolean occursIn(String text) {
    return text.contains(open) || text.contains(close) || text.contains(separator);
  }

  private static void check(String name, String value) {
    Objects.requireNonNull(value, name);
    if (value.isEmpty() || value.length() > MAX_LENGTH) {
      throw new IllegalArgumentException("the " + name + " string must be 1 to " + MAX_LENGTH + " characters");
    }
    if (value.chars().anyMatch(c -> Character.isISOControl(c))) {
      throw new IllegalArgumentException("the " + name + " string must not hold control characters");
    }
  }
}
