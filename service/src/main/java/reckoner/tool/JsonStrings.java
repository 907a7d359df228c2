package reckoner.tool;

import java.util.Locale;

/** Writing JSON strings without a JSON library: what canonical arguments and ledger records need. */
public final class JsonStrings {
  private JsonStrings() {}

  /**
   * Appends {@code s} as a JSON string. Escapes what RFC 8259 section 7 requires, and U+2028/9
   * (so the text is also safe inside JavaScript). Returns {@code sb}.
   */
  public static StringBuilder quote(StringBuilder sb, String s) {
    sb.append('"');
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '"' -> sb.append("\\\"");
        case '\\' -> sb.append("\\\\");
        case '\n' -> sb.append("\\n");
        case '\r' -> sb.append("\\r");
        case '\t' -> sb.append("\\t");
        default -> {
          if (c < 0x20 || c == 0x2028 || c == 0x2029) {
            sb.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
          } else {
            sb.append(c);
          }
        }
      }
    }
    return sb.append('"');
  }
}
