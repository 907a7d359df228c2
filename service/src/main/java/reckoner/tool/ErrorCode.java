package reckoner.tool;

import java.util.Locale;

/**
 * The stable error codes of the contract. Their {@link #wireName()} is what callers see and match
 * on; it never changes for a published code.
 */
public enum ErrorCode {
  // Request-level codes.
  INVALID_ARGUMENT,
  UNKNOWN_TOOL,
  UNAUTHORIZED,
  FORBIDDEN,
  RATE_LIMITED,
  PAYLOAD_TOO_LARGE,
  UNAVAILABLE,
  /** An Idempotency-Key sent again with other content, or while its first request still runs (409). */
  IDEMPOTENCY_CONFLICT,
  // HTTP-level codes that the contract leaves open (see README, "Errors").
  UNKNOWN_ENDPOINT,
  METHOD_NOT_ALLOWED,
  UNSUPPORTED_MEDIA_TYPE,
  /** The request line and headers are larger than the server reads (431). */
  HEADER_TOO_LARGE,
  /** The request's URI is longer than the server reads (414). */
  URI_TOO_LONG,
  NOT_ACCEPTABLE,
  /** A defect on our side; never caused by input alone. Shows no internals. */
  INTERNAL_ERROR,
  /** An answer that holds a splice markup string and so cannot be spliced without ambiguity. */
  UNSPLICEABLE,
  /** A data file (fact set) failed validation on reload; the old data keeps serving. */
  DATA_ERROR,
  // arith
  SYNTAX_ERROR,
  DOMAIN_ERROR,
  OVERFLOW,
  LIMIT_EXCEEDED,
  // dates
  INVALID_DATE,
  INVALID_DURATION,
  UNKNOWN_ZONE,
  UNKNOWN_CALENDAR,
  OUT_OF_RANGE,
  /** A date, time, zone or region that has more than one reading; the readings are listed. */
  AMBIGUOUS_DATE,
  /** A holiday region that the holiday rules do not know. */
  UNKNOWN_REGION,
  // units
  UNKNOWN_UNIT,
  AMBIGUOUS_UNIT,
  DIMENSION_MISMATCH,
  // facts
  NOT_FOUND;

  private final String wireName = name().toLowerCase(Locale.ROOT);

  /** The code as it appears on the wire, e.g. {@code syntax_error}. */
  public String wireName() {
    return wireName;
  }

  /** The code whose wire name is {@code wire}, if any. */
  public static java.util.Optional<ErrorCode> fromWireName(String wire) {
    for (ErrorCode c : values()) {
      if (c.wireName.equals(wire)) {
        return java.util.Optional.of(c);
      }
    }
    return java.util.Optional.empty();
  }

  @Override
  public String toString() {
    return wireName;
  }
}
