package reckoner.http;

import reckoner.tool.ErrorCode;

/**
 * The one mapping from error codes to HTTP: status, title and the RFC 9457 problem type. Every
 * error a caller can see goes through here. The switches are exhaustive, so a new code does not
 * compile until it is mapped.
 */
final class Problem {
  private Problem() {}

  /** 400 for a malformed request, 422 for a well-formed call whose input the tool cannot compute. */
  static int status(ErrorCode code) {
    return switch (code) {
      case INVALID_ARGUMENT -> 400;
      case UNAUTHORIZED -> 401;
      case FORBIDDEN -> 403;
      case UNKNOWN_TOOL, UNKNOWN_ENDPOINT, NOT_FOUND -> 404;
      case METHOD_NOT_ALLOWED -> 405;
      case IDEMPOTENCY_CONFLICT -> 409;
      case NOT_ACCEPTABLE -> 406;
      case PAYLOAD_TOO_LARGE -> 413;
      case UNSUPPORTED_MEDIA_TYPE -> 415;
      case HEADER_TOO_LARGE -> 431;
      case URI_TOO_LONG -> 414;
      case RATE_LIMITED -> 429;
      case UNAVAILABLE -> 503;
      case INTERNAL_ERROR -> 500;
      case SYNTAX_ERROR, DOMAIN_ERROR, OVERFLOW, LIMIT_EXCEEDED,
          INVALID_DATE, INVALID_DURATION, UNKNOWN_ZONE, UNKNOWN_CALENDAR, OUT_OF_RANGE, AMBIGUOUS_DATE, UNKNOWN_REGION,
          UNKNOWN_UNIT, AMBIGUOUS_UNIT, DIMENSION_MISMATCH, UNSPLICEABLE, DATA_ERROR -> 422;
    };
  }

  static String title(ErrorCode code) {
    return switch (code) {
      case INVALID_ARGUMENT -> "Invalid argument";
      case UNAUTHORIZED -> "Unauthorized";
      case FORBIDDEN -> "Forbidden";
      case UNKNOWN_TOOL -> "Unknown tool";
      case UNKNOWN_ENDPOINT -> "Unknown endpoint";
      case NOT_FOUND -> "Not found";
      case METHOD_NOT_ALLOWED -> "Method not allowed";
      case IDEMPOTENCY_CONFLICT -> "Idempotency conflict";
      case NOT_ACCEPTABLE -> "Not acceptable";
      case PAYLOAD_TOO_LARGE -> "Payload too large";
      case UNSUPPORTED_MEDIA_TYPE -> "Unsupported media type";
      case HEADER_TOO_LARGE -> "Request header fields too large";
      case URI_TOO_LONG -> "URI too long";
      case RATE_LIMITED -> "Rate limited";
      case UNAVAILABLE -> "Unavailable";
      case INTERNAL_ERROR -> "Internal error";
      case SYNTAX_ERROR -> "Syntax error";
      case DOMAIN_ERROR -> "Domain error";
      case OVERFLOW -> "Overflow";
      case LIMIT_EXCEEDED -> "Limit exceeded";
      case INVALID_DATE -> "Invalid date";
      case INVALID_DURATION -> "Invalid duration";
      case UNKNOWN_ZONE -> "Unknown time zone";
      case UNKNOWN_CALENDAR -> "Unknown calendar";
      case OUT_OF_RANGE -> "Out of range";
      case AMBIGUOUS_DATE -> "Ambiguous date";
      case UNKNOWN_REGION -> "Unknown holiday region";
      case UNKNOWN_UNIT -> "Unknown unit";
      case AMBIGUOUS_UNIT -> "Ambiguous unit";
      case DIMENSION_MISMATCH -> "Dimension mismatch";
      case UNSPLICEABLE -> "Answer cannot be spliced";
      case DATA_ERROR -> "Data file error";
    };
  }

  /** The problem type: a relative URI reference that this server answers ({@code GET /problems/CODE}). */
  static String type(ErrorCode code) {
    return "/problems/" + code.wireName();
  }
}
