package reckoner.units;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;

/**
 * Finds, for a phrase that {@code units@2} refuses, the nearest phrase that it answers: the
 * refused word replaced by a suggestion or by one of its readings ({@code 1 ton to kg} becomes
 * {@code 1 ton_short to kg}), an ambiguous number by one of its readings, a missing {@code to}
 * put in, a missing last unit added ({@code 5 ft 11} becomes {@code 5 ft 11 in}), an invisible
 * character removed, or a target of the quantity's own kind put in ({@code 1 cup to g} becomes
 * {@code 1 cup to mL}). Every candidate is tried, in that order, and only one that is answered is
 * named: a refusal never points to a phrase that fails too. Pure functions of the text, the error
 * and the attempt.
 */
final class Nearest {
  /** At most this many candidates are tried for one refusal. */
  static final int MAX_ATTEMPTS = 24;

  /** Units a dangling last amount may have had, tried in order ({@code 5 ft 11}, {@code 2 lb 3}). */
  private static final List<String> SMALLER = List.of("in", "oz", "lb", "min", "s", "cm", "ft", "′");
  /** Targets of common kinds, for a quantity asked in a unit of another kind. */
  private static final List<String> KINDS = List.of("mL", "L", "g", "kg", "m", "km", "s", "K", "J", "W", "Pa",
      "km/h", "m^2", "N", "rad");
  private static final List<String> SEPARATORS = List.of(" to ", " in ", " into ", " -> ", " as ");

  /** Answers a phrase, or says it is refused; never asks for a nearest phrase itself. */
  @FunctionalInterface
  interface Attempt {
    boolean answers(String text);
  }

  private Nearest() {}

  /** The nearest phrase to {@code text} that is answered, if one of the candidates is. */
  static Optional<String> phrase(String text, ToolError error, Attempt attempt) {
    int tried = 0;
    for (String candidate : candidates(text, error)) {
      if (tried++ >= MAX_ATTEMPTS) {
        break;
      }
      if (!candidate.equals(text) && attempt.answers(candidate)) {
        return Optional.of(candidate);
      }
    }
    return Optional.empty();
  }

  static Set<String> candidates(String text, ToolError error) {
    Set<String> out = new LinkedHashSet<>();
    String visible = visible(text);
    if (!visible.equals(text)) {
      out.add(visible);
      return out;
    }
    String written = quoted(error.detail());
    if (written != null) {
      for (String s : error.suggestions()) {
        replaceWord(text, written, s).ifPresent(out::add);
      }
    }
    if (error.code() == ErrorCode.SYNTAX_ERROR) {
      String detail = error.detail();
      if (detail.startsWith("the text must start with")) {
        out.add("1 " + text);
      }
      if (detail.contains("has no unit")) {
        for (String unit : SMALLER) {
          out.add(addUnit(text, unit));
        }
      }
      if (detail.startsWith("expected 'to'")) {
        String[] words = text.split(" ");
        for (int i = words.length - 1; i >= 2; i--) {
          out.add(String.join(" ", java.util.Arrays.copyOfRange(words, 0, i)) + " to "
              + String.join(" ", java.util.Arrays.copyOfRange(words, i, words.length)));
        }
      }
    }
    if (error.code() == ErrorCode.DIMENSION_MISMATCH || error.code() == ErrorCode.UNKNOWN_UNIT
        || error.code() == ErrorCode.AMBIGUOUS_UNIT) {
      int at = lastSeparator(text);
      if (at >= 0) {
        String head = text.substring(0, at);
        String sep = text.substring(at, text.indexOf(' ', at + 1) + 1);
        for (String kind : KINDS) {
          out.add(head + sep + kind);
        }
      }
    }
    return out;
  }

  /** The first single-quoted part of an error detail: the word the error is about. */
  private static String quoted(String detail) {
    int a = detail.indexOf('\'');
    int b = a < 0 ? -1 : detail.indexOf('\'', a + 1);
    return b > a + 1 ? detail.substring(a + 1, b) : null;
  }

  /** {@code text} with the first whole-word occurrence of {@code word} replaced. */
  private static Optional<String> replaceWord(String text, String word, String replacement) {
    int from = 0;
    while (true) {
      int i = text.indexOf(word, from);
      if (i < 0) {
        return Optional.empty();
      }
      int end = i + word.length();
      boolean before = i == 0 || !Character.isLetterOrDigit(text.charAt(i - 1)) || !Character.isLetterOrDigit(word.charAt(0));
      boolean after = end == text.length() || !Character.isLetterOrDigit(text.charAt(end))
          || !Character.isLetterOrDigit(word.charAt(word.length() - 1));
      if (before && after) {
        return Optional.of(text.substring(0, i) + replacement + text.substring(end));
      }
      from = i + 1;
    }
  }

  /** {@code 5 ft 11 to cm} with a unit after the last amount of the quantity: {@code 5 ft 11 in to cm}. */
  private static String addUnit(String text, String unit) {
    int at = lastSeparator(text);
    String head = at < 0 ? text : text.substring(0, at);
    return head + " " + unit + (at < 0 ? "" : text.substring(at));
  }

  private static int lastSeparator(String text) {
    String lower = text.toLowerCase(Locale.ROOT);
    int best = -1;
    for (String sep : SEPARATORS) {
      best = Math.max(best, lower.lastIndexOf(sep));
    }
    return best;
  }

  /** {@code text} without its invisible and control characters. */
  private static String visible(String text) {
    StringBuilder sb = new StringBuilder(text.length());
    text.codePoints().filter(cp -> {
      int type = Character.getType(cp);
      return type != Character.FORMAT && type != Character.CONTROL && type != Character.SURROGATE;
    }).forEach(sb::appendCodePoint);
    return sb.toString();
  }
}
