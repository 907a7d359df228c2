package reckoner.arith;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * The first pass over an expression: checks the limits, reads every number literal exactly as a
 * decimal, and rewrites the expression for exp4j with each literal replaced by a placeholder
 * variable ({@code _0}, {@code _1}, ...). exp4j then supplies the grammar (precedence,
 * associativity, functions) while the digits never pass through a binary double.
 */
final class Scanner {
  static final int MAX_LENGTH = 1000;
  static final int MAX_DEPTH = 50;
  static final int MAX_LITERAL_EXPONENT = 9999;

  /** The rewritten text and the literal values its placeholders stand for, in order. */
  record Scanned(String rewritten, List<BigDecimal> literals) {}

  private Scanner() {}

  static Scanned scan(String expr) throws ToolException {
    if (expr.length() > MAX_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED,
          "expression is " + expr.length() + " characters long; the limit is " + MAX_LENGTH);
    }
    StringBuilder out = new StringBuilder(expr.length() + 16);
    List<BigDecimal> literals = new ArrayList<>();
    int depth = 0;
    boolean lastWasLiteral = false;
    int i = 0;
    while (i < expr.length()) {
      char c = expr.charAt(i);
      if (isDigit(c) || (c == '.' && i + 1 < expr.length() && isDigit(expr.charAt(i + 1)))) {
        if (lastWasLiteral) {
          throw syntax("two numbers with nothing between them at position " + (i + 1));
        }
        int end = literalEnd(expr, i);
        literals.add(literal(expr.substring(i, end), i));
        out.append(" _").append(literals.size() - 1).append(' ');
        lastWasLiteral = true;
        i = end;
        continue;
      }
      if (Character.isLetter(c) || c == '_') {
        int end = i;
        while (end < expr.length() && (Character.isLetterOrDigit(expr.charAt(end)) || expr.charAt(end) == '_')) {
          end++;
        }
        String name = expr.substring(i, end);
        if (c == '_') {
          throw syntax("unknown name '" + name + "' at position " + (i + 1));
        }
        out.append(name);
        lastWasLiteral = false;
        i = end;
        continue;
      }
      if (Character.isWhitespace(c)) {
        out.append(' ');
        i++;
        continue;
      }
      lastWasLiteral = false;
      switch (c) {
        case '(' -> {
          if (++depth > MAX_DEPTH) {
            throw new ToolException(ErrorCode.LIMIT_EXCEEDED,
                "parentheses nest deeper than " + MAX_DEPTH + " levels at position " + (i + 1));
          }
          out.append(c);
        }
        case ')' -> {
          if (--depth < 0) {
            throw syntax("unmatched ')' at position " + (i + 1));
          }
          out.append(c);
        }
        case '+', '-', '*', '/', '^', '%', ',' -> out.append(c);
        case '\u2212' -> out.append('-'); // minus sign
        case '\u00d7', '\u00b7', '\u22c5' -> out.append('*'); // multiplication sign, middle dot, dot operator
        case '\u00f7' -> out.append('/'); // division sign
        default -> throw syntax("unexpected character '" + printable(c) + "' at position " + (i + 1));
      }
      i++;
    }
    if (depth > 0) {
      throw syntax("missing ')': " + depth + " parenthesis" + (depth == 1 ? " is" : "es are") + " not closed");
    }
    if (out.toString().isBlank()) {
      throw syntax("the expression is empty");
    }
    return new Scanned(out.toString(), literals);
  }

  /** Literal grammar: digits [. digits] [e [+-] digits], or . digits; "e" without digits is the constant. */
  private static int literalEnd(String s, int start) {
    int i = start;
    while (i < s.length() && isDigit(s.charAt(i))) {
      i++;
    }
    if (i < s.length() && s.charAt(i) == '.') {
      i++;
      while (i < s.length() && isDigit(s.charAt(i))) {
        i++;
      }
    }
    if (i < s.length() && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
      int j = i + 1;
      if (j < s.length() && (s.charAt(j) == '+' || s.charAt(j) == '-')) {
        j++;
      }
      if (j < s.length() && isDigit(s.charAt(j))) {
        while (j < s.length() && isDigit(s.charAt(j))) {
          j++;
        }
        return j;
      }
    }
    return i;
  }

  private static BigDecimal literal(String text, int position) throws ToolException {
    String normal = text.endsWith(".") ? text.substring(0, text.length() - 1) : text;
    int e = Math.max(normal.indexOf('e'), normal.indexOf('E'));
    if (e >= 0) {
      String exponent = normal.substring(e + 1).replace("+", "");
      String digits = exponent.startsWith("-") ? exponent.substring(1) : exponent;
      if (digits.replaceFirst("^0+", "").length() > 5) {
        throw new ToolException(ErrorCode.OVERFLOW, "the number " + clip(text) + " at position " + (position + 1)
            + " is out of range (|x| must lie between 1e-" + MAX_LITERAL_EXPONENT + " and 1e" + MAX_LITERAL_EXPONENT + ")");
      }
    }
    BigDecimal value = new BigDecimal(normal);
    if (value.signum() != 0 && Math.abs(DecimalMath.exponentOf(value)) > MAX_LITERAL_EXPONENT) {
      throw new ToolException(ErrorCode.OVERFLOW, "the number " + clip(text) + " at position " + (position + 1)
          + " is out of range (|x| must lie between 1e-" + MAX_LITERAL_EXPONENT + " and 1e" + MAX_LITERAL_EXPONENT + ")");
    }
    return value;
  }

  private static String clip(String s) {
    return s.length() <= 24 ? s : s.substring(0, 20) + "…";
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private static String printable(char c) {
    return Character.isISOControl(c) || Character.isWhitespace(c) ? String.format(java.util.Locale.ROOT, "U+%04X", (int) c)
        : String.valueOf(c);
  }

  private static ToolException syntax(String detail) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, detail);
  }
}
