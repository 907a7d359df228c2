package reckoner.http;

import java.util.Locale;

/**
 * An {@code Accept} header (RFC 9110, section 12.5.1) read for the two forms this server answers
 * in: JSON ({@code application/json}, and {@code application/problem+json} for errors) and the
 * bare line ({@code text/plain}). Each form gets the weight of the most specific media range that
 * matches it ({@code text/plain} before {@code text/*} before {@code *}{@code /*}); a form no
 * range matches has weight 0. No header means any form. Immutable.
 *
 * @param json the weight of JSON, 0 to 1
 * @param text the weight of text/plain, 0 to 1
 */
record AcceptHeader(double json, double text) {
  static final AcceptHeader ANY = new AcceptHeader(1, 1);

  /** Reads {@code header}; null or blank is {@link #ANY}. Malformed elements are ignored. */
  static AcceptHeader parse(String header) {
    if (header == null || header.isBlank()) {
      return ANY;
    }
    Weight json = new Weight();
    Weight text = new Weight();
    for (String element : header.split(",")) {
      String[] parts = element.split(";");
      String range = parts[0].trim().toLowerCase(Locale.ROOT);
      double q = 1;
      boolean malformed = false;
      for (int i = 1; i < parts.length; i++) {
        String param = parts[i].trim();
        if (param.regionMatches(true, 0, "q=", 0, 2)) {
          q = quality(param.substring(2).trim());
          malformed = q < 0;
        }
      }
      if (malformed || range.isEmpty()) {
        continue;
      }
      json.offer(specificity(range, "application", "json", "problem+json"), q);
      text.offer(specificity(range, "text", "plain", null), q);
    }
    return new AcceptHeader(json.q, text.q);
  }

  /** Whether the bare line is preferred: text weighs more than JSON (a tie goes to JSON, the default form). */
  boolean prefersText() {
    return text > json;
  }

  /** Whether neither form is acceptable. */
  boolean acceptsNeither() {
    return json <= 0 && text <= 0;
  }

  /** 3 for the exact type, 2 for {@code type/*}, 1 for {@code *}{@code /*}, 0 for no match. */
  private static int specificity(String range, String type, String subtype, String altSubtype) {
    if (range.equals("*/*") || range.equals("*")) {
      return 1;
    }
    int slash = range.indexOf('/');
    if (slash < 0 || !range.substring(0, slash).equals(type)) {
      return 0;
    }
    String sub = range.substring(slash + 1);
    if (sub.equals("*")) {
      return 2;
    }
    return sub.equals(subtype) || sub.equals(altSubtype) ? 3 : 0;
  }

  /** A qvalue ("0", "0.5", "1.000"), or -1 when malformed. */
  private static double quality(String value) {
    if (!value.matches("0(\\.\\d{0,3})?|1(\\.0{0,3})?")) {
      return -1;
    }
    return Double.parseDouble(value);
  }

  /** The weight of the most specific range seen so far (among equally specific ones, the highest). */
  private static final class Weight {
    int specificity;
    double q;

    void offer(int specificity, double q) {
      if (specificity > this.specificity || (specificity == this.specificity && specificity > 0 && q > this.q)) {
        this.specificity = specificity;
        this.q = q;
      }
    }
  }
}
