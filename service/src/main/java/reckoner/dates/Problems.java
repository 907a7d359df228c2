package reckoner.dates;

import java.util.List;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/** The errors of this family, with the caller's text quoted safely. */
final class Problems {
  private static final int QUOTE_LIMIT = 40;

  private Problems() {}

  /** {@code 'text'}, cut to a short one-line excerpt. */
  static String quote(String text) {
    return "'" + ResultText.clean(text, QUOTE_LIMIT) + "'";
  }

  static ToolException invalidDate(String detail) {
    return new ToolException(ErrorCode.INVALID_DATE, detail);
  }

  static ToolException invalidDuration(String detail) {
    return new ToolException(ErrorCode.INVALID_DURATION, detail);
  }

  static ToolException outOfRange(String detail) {
    return new ToolException(ErrorCode.OUT_OF_RANGE, detail);
  }

  static ToolException invalidArgument(String detail) {
    return new ToolException(ErrorCode.INVALID_ARGUMENT, detail);
  }

  static ToolException withSuggestions(ErrorCode code, String detail, List<String> suggestions) {
    return new ToolException(new ToolError(code, detail, suggestions));
  }
}
