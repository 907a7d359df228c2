package reckoner.ledger;

import java.util.Locale;

/** The few JSON writing helpers the ledger needs: quoted strings and nulls. Pure functions. */
final class JsonText {
  private JsonText() {}

  /** Appends {@code s} as a JSON string, or {@code null}. Escapes what RFC 8259 section 7 requires, and U+2028/9. */
  static StringBuilder quote(StringBuilder sb, String s) {
    if (s == null) {
      return sb.append("null");
    }
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
