package reckoner.splice;

import java.util.List;
import java.util.Objects;

/**
 * The strings that mark a call inside text: {@code OPEN NAME(INPUT) CLOSE} for a call, answered as
 * {@code OPEN NAME(INPUT) SEPARATOR TEXT CLOSE}. The default is {@code <:arith(1+1):>}, answered
 * {@code <:arith(1+1) :: 2:>}: plain ASCII that prose, source code and wiki or template markup
 * rarely hold, with no arrow or equals sign. Each string is 1 to {@value #MAX_LENGTH} characters,
 * none a control character (so a tokenizer's reserved tokens such as
 * {@code <|reserved_special_token_10|>} fit); the three are different, none contains another, and
 * a call with an answer reads back as written, so a document parses one way. Immutable.
 */
public record Markup(String open, String separator, String close) {
  public static final Markup DEFAULT = new Markup("<:", " :: ", ":>");
  /** The longest markup string, in characters. */
  public static final int MAX_LENGTH = 64;

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
    // Strings that run into a call's own text (a closing string that starts with ')', say) would
    // end every call early: refuse them here rather than refuse every answer later.
    for (String sample : List.of("t(x)", "t@2(1 + 2)")) {
      String call = open + sample + close;
      String answered = open + sample + separator + "a" + close;
      if (!Document.readsBack(call, call.length(), sample, null, open, separator, close)
          || !Document.readsBack(answered, answered.length(), sample, "a", open, separator, close)) {
        throw new IllegalArgumentException("markup strings must let a call such as " + sample
            + " read back as written; these run into the call's own text");
      }
    }
  }

  /** The default markup with any of the three strings replaced (null keeps the default). */
  public static Markup of(String open, String separator, String close) {
    return new Markup(open == null ? DEFAULT.open : open, separator == null ? DEFAULT.separator : separator,
        close == null ? DEFAULT.close : close);
  }

  /** Whether {@code text} holds any of the three strings. */
  public boolean occursIn(String text) {
    return text.contains(open) || text.contains(close) || text.contains(separator);
  }

  private static void check(String name, String value) {
    Objects.requireNonNull(value, name);
    if (value.isEmpty() || value.length() > MAX_LENGTH) {
      throw new IllegalArgumentException("the " + name + " string must be 1 to " + MAX_LENGTH + " characters but had "
          + value.length());
    }
    if (value.chars().anyMatch(c -> Character.isISOControl(c))) {
      throw new IllegalArgumentException("the " + name + " string must not hold control characters");
    }
  }
}
