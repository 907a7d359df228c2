package reckoner.facts;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads one line of a fact file: a JSON object by RFC 8259, strictly (no comments, no trailing
 * commas, no duplicate member names, no raw control characters in strings). Values come back as
 * {@link String}, {@link Boolean}, {@link BigDecimal}, {@link List}, {@link Map} (in member order)
 * or {@link #NULL}. Small on purpose: a fact file is flat records, and this package keeps no JSON
 * library. Stateless; thread-safe.
 */
final class JsonLine {
  /** The JSON {@code null} value. */
  static final Object NULL = new Object() {
    @Override
    public String toString() {
      return "null";
    }
  };

  /** Deepest nesting accepted; facts are flat, so this only stops pathological input. */
  static final int MAX_DEPTH = 8;

  /** Why a line is not a JSON object, and at which column (1-based, in UTF-16 units). */
  static final class Malformed extends Exception {
    private static final long serialVersionUID = 1L;
    private final int column;

    Malformed(int column, String message) {
      super(message, null, false, false);
      this.column = column;
    }

    int column() {
      return column;
    }
  }

  private final String text;
  private int pos;

  private JsonLine(String text) {
    this.text = text;
  }

  /** Parses {@code line}, which must hold exactly one JSON object. */
  static Map<String, Object> parseObject(String line) throws Malformed {
    JsonLine p = new JsonLine(line);
    p.skipSpace();
    if (p.peek() != '{') {
      throw p.error("expected a JSON object starting with '{'");
    }
    Map<String, Object> object = p.object(1);
    p.skipSpace();
    if (p.pos < line.length()) {
      throw p.error("unexpected text after the object");
    }
    return object;
  }

  private Object value(int depth) throws Malformed {
    skipSpace();
    char c = peek();
    switch (c) {
      case '{':
        return object(depth + 1);
      case '[':
        return array(depth + 1);
      case '"':
        return string();
      case 't':
        return literal("true", Boolean.TRUE);
      case 'f':
        return literal("false", Boolean.FALSE);
      case 'n':
        return literal("null", NULL);
      default:
        if (c == '-' || (c >= '0' && c <= '9')) {
          return number();
        }
        throw error(pos >= text.length() ? "unexpected end of line" : "unexpected character '" + c + "'");
    }
  }

  private Map<String, Object> object(int depth) throws Malformed {
    if (depth > MAX_DEPTH) {
      throw error("nesting deeper than " + MAX_DEPTH);
    }
    pos++; // '{'
    Map<String, Object> members = new LinkedHashMap<>();
    skipSpace();
    if (peek() == '}') {
      pos++;
      return members;
    }
    while (true) {
      skipSpace();
      if (peek() != '"') {
        throw error("expected a member name in double quotes");
      }
      int at = pos;
      String name = memberName();
      skipSpace();
      expect(':');
      Object value = value(depth);
      if (members.putIfAbsent(name, value) != null) {
        pos = at;
        throw error("duplicate member \"" + name + "\"");
      }
      skipSpace();
      if (peek() == ',') {
        pos++;
      } else if (peek() == '}') {
        pos++;
        return members;
      } else {
        throw error("expected ',' or '}'");
      }
    }
  }

  private List<Object> array(int depth) throws Malformed {
    if (depth > MAX_DEPTH) {
      throw error("nesting deeper than " + MAX_DEPTH);
    }
    pos++; // '['
    List<Object> items = new ArrayList<>();
    skipSpace();
    if (peek() == ']') {
      pos++;
      return items;
    }
    while (true) {
      items.add(value(depth));
      skipSpace();
      if (peek() == ',') {
        pos++;
      } else if (peek() == ']') {
        pos++;
        return items;
      } else {
        throw error("expected ',' or ']'");
      }
    }
  }

  /** The names fact files use on every line, shared instead of copied per line. */
  private static final String[] KNOWN_NAMES = {
      "set", "key", "value", "aliases", "valid_from", "valid_to", "source", "options", "fold_accents"};

  private String memberName() throws Malformed {
    for (String known : KNOWN_NAMES) {
      int end = pos + 1 + known.length();
      if (end < text.length() && text.charAt(end) == '"' && text.startsWith(known, pos + 1)) {
        pos = end + 1;
        return known;
      }
    }
    return string();
  }

  private String string() throws Malformed {
    pos++; // opening quote
    StringBuilder sb = null;
    int start = pos;
    while (true) {
      if (pos >= text.length()) {
        throw error("unterminated string");
      }
      char c = text.charAt(pos);
      if (c == '"') {
        String s = sb == null ? text.substring(start, pos) : sb.append(text, start, pos).toString();
        pos++;
        return s;
      }
      if (c < 0x20) {
        throw error(String.format(java.util.Locale.ROOT, "raw control character U+%04X in a string (escape it)", (int) c));
      }
      if (c == '\\') {
        if (sb == null) {
          sb = new StringBuilder();
        }
        sb.append(text, start, pos);
        pos++;
        sb.append(escape());
        start = pos;
      } else {
        pos++;
      }
    }
  }

  private char escape() throws Malformed {
    if (pos >= text.length()) {
      throw error("unterminated escape");
    }
    char c = text.charAt(pos++);
    switch (c) {
      case '"': return '"';
      case '\\': return '\\';
      case '/': return '/';
      case 'b': return '\b';
      case 'f': return '\f';
      case 'n': return '\n';
      case 'r': return '\r';
      case 't': return '\t';
      case 'u':
        if (pos + 4 > text.length()) {
          throw error("\\u needs four hex digits");
        }
        int v = 0;
        for (int i = 0; i < 4; i++) {
          int d = hexDigit(text.charAt(pos + i));
          if (d < 0) {
            throw error("\\u needs four hex digits");
          }
          v = v * 16 + d;
        }
        pos += 4;
        return (char) v;
      default:
        pos--;
        throw error("unknown escape \\" + c);
    }
  }

  private static int hexDigit(char h) {
    if (h >= '0' && h <= '9') {
      return h - '0';
    }
    if (h >= 'a' && h <= 'f') {
      return h - 'a' + 10;
    }
    return h >= 'A' && h <= 'F' ? h - 'A' + 10 : -1;
  }

  private BigDecimal number() throws Malformed {
    int start = pos;
    if (peek() == '-') {
      pos++;
    }
    if (peek() == '0') {
      pos++;
    } else if (!digits()) {
      throw error("malformed number");
    }
    if (peek() == '.') {
      pos++;
      if (!digits()) {
        throw error("malformed number");
      }
    }
    if (peek() == 'e' || peek() == 'E') {
      pos++;
      if (peek() == '+' || peek() == '-') {
        pos++;
      }
      if (!digits()) {
        throw error("malformed number");
      }
    }
    if (pos - start > 100) {
      throw error("number longer than 100 characters");
    }
    return new BigDecimal(text.substring(start, pos));
  }

  private boolean digits() {
    int start = pos;
    while (pos < text.length() && text.charAt(pos) >= '0' && text.charAt(pos) <= '9') {
      pos++;
    }
    return pos > start;
  }

  private Object literal(String word, Object value) throws Malformed {
    if (!text.startsWith(word, pos)) {
      throw error("unexpected character '" + peek() + "'");
    }
    pos += word.length();
    return value;
  }

  private void expect(char c) throws Malformed {
    if (peek() != c) {
      throw error("expected '" + c + "'");
    }
    pos++;
  }

  private char peek() {
    return pos < text.length() ? text.charAt(pos) : '\0';
  }

  /** JSON's four white-space characters only (RFC 8259, section 2). */
  private void skipSpace() {
    while (pos < text.length()) {
      char c = text.charAt(pos);
      if (c != ' ' && c != '\t' && c != '\n' && c != '\r') {
        return;
      }
      pos++;
    }
  }

  private Malformed error(String message) {
    return new Malformed(pos + 1, pos >= text.length() && !message.startsWith("unexpected end") && !message.startsWith("unterminated")
        ? message + " but the line ended" : message);
  }
}
