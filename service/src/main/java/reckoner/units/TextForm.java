package reckoner.units;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolException;

/**
 * Reads the free-text form {@code [convert] VALUE FROM to TO} (also {@code in}), keywords in any
 * case: {@code 3.5 km to mi}, {@code 8 L/100km to mpg}, {@code 12 in in cm}. The units are found by
 * trying each {@code to} (then each {@code in}) as the split and keeping the one where both sides
 * parse; if two splits both parse, the text is ambiguous and refused.
 */
final class TextForm {
  /** A decimal with optional sign and exponent, no grouping: 3.5, -40, 1e-3, .5 */
  static final Pattern DECIMAL = Pattern.compile("[+\\-−]?(?:[0-9]+(?:\\.[0-9]*)?|\\.[0-9]+)(?:[eE][+\\-]?[0-9]+)?");
  private static final Pattern LEADING_VALUE = Pattern.compile("^(" + DECIMAL.pattern() + ")");

  /** The structured form of a text call. */
  record Parsed(BigDecimal value, String from, String to) {}

  /** Reads a unit expression; the tool passes its cached parser. */
  @FunctionalInterface
  interface UnitReader {
    Unit read(String expression) throws ToolException;
  }

  private TextForm() {}

  static Parsed parse(String text, UnitReader units) throws ToolException {
    String s = ResultText.clean(text, Math.max(1, text.length()));
    if (s.length() > 1000) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the text may have at most 1000 characters but has " + s.length());
    }
    if (s.toLowerCase(Locale.ROOT).startsWith("convert ")) {
      s = s.substring("convert ".length()).strip();
    }
    Matcher m = LEADING_VALUE.matcher(s);
    if (!m.find()) {
      throw form("the text must start with a number");
    }
    BigDecimal value = parseDecimal(m.group(1));
    String rest = s.substring(m.end()).strip();
    if (rest.startsWith(",") && rest.length() > 1 && Character.isDigit(rest.charAt(1))) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "write the value without grouping separators, as in 1000 or 1500.5");
    }
    List<String> words = Arrays.asList(rest.split(" "));
    if (words.stream().filter(w -> w.equalsIgnoreCase("to")).count() > 1) {
      throw form("the text has more than one 'to'");
    }
    Split split = trySplits(words, "to", units);
    if (split.chosen == null && split.firstError == null) {
      split = trySplits(words, "in", units);
    }
    if (split.chosen != null) {
      return new Parsed(value, split.chosen[0], split.chosen[1]);
    }
    if (split.firstError != null) {
      throw split.firstError;
    }
    throw form("expected ' to ' (or ' in ') between the two units");
  }

  /** Parses a decimal as written in a text or a {@code value} string; invalid_argument otherwise. */
  static BigDecimal parseDecimal(String s) throws ToolException {
    String t = s.strip().replace('−', '-');
    if (t.length() > 1100 || !DECIMAL.matcher(t).matches()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "value must be a decimal number such as 3.5, -40 or 1e-3"
          + " but was '" + ResultText.clean(s, 40) + "'");
    }
    try {
      return new BigDecimal(t.startsWith("+") ? t.substring(1) : t);
    } catch (NumberFormatException e) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "value '" + ResultText.clean(s, 40) + "' is out of range");
    }
  }

  private static final class Split {
    String[] chosen;
    ToolException firstError;
  }

  private static Split trySplits(List<String> words, String keyword, UnitReader units) throws ToolException {
    Split result = new Split();
    List<String[]> valid = new ArrayList<>();
    for (int i = 1; i < words.size() - 1; i++) {
      if (!words.get(i).equalsIgnoreCase(keyword)) {
        continue;
      }
      String from = String.join(" ", words.subList(0, i));
      String to = String.join(" ", words.subList(i + 1, words.size()));
      try {
        units.read(from);
        units.read(to);
        valid.add(new String[] {from, to});
      } catch (ToolException e) {
        if (result.firstError == null) {
          result.firstError = e;
        }
      }
    }
    if (valid.size() > 1) {
      throw form("the text can be read as '" + valid.get(0)[0] + "' to '" + valid.get(0)[1] + "' or as '"
          + valid.get(1)[0] + "' to '" + valid.get(1)[1] + "'; use the structured from and to arguments");
    }
    if (valid.size() == 1) {
      result.chosen = valid.get(0);
      result.firstError = null;
    }
    return result;
  }

  private static ToolException form(String what) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, what + "; expected 'VALUE FROM to TO', as in '3.5 km to mi'");
  }
}
