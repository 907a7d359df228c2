package reckoner.ledger;

/** The few JSON writing helpers the ledger needs: quoted strings and nulls. Pure functions. */
final class JsonText {
  private JsonText() {}

  /** Appends {@code s} as a JSON string, or {@code null}. Escapes what RFC 8259 section 7 requires, and U+2028/9. */
  static StringBuilder quote(StringBuilder sb, String s) {
    if (s == null) {
      return sb.append("null");
    }
    return reckoner.tool.JsonStrings.quote(sb, s);
  }
}
