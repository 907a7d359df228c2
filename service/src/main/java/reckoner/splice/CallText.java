package reckoner.splice;

import java.util.Objects;
import java.util.OptionalInt;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * One call as a model wrote it between the markup: {@code NAME(INPUT)} or
 * {@code NAME@VERSION(INPUT)}. INPUT runs from the first {@code (} to the last {@code )}, so it may
 * hold parentheses of its own ({@code arith((1+2)*3)}). Immutable.
 */
public record CallText(String tool, OptionalInt version, String input) {
  public static final int MAX_INPUT = 10_000;

  public CallText {
    Objects.requireNonNull(tool, "tool");
    Objects.requireNonNull(version, "version");
    Objects.requireNonNull(input, "input");
  }

  /** Parses the text between the markup; a malformed call is a syntax_error saying what is wrong. */
  public static CallText parse(String text) throws ToolException {
    String s = text.strip();
    int paren = s.indexOf('(');
    if (paren < 0 || !s.endsWith(")")) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "a call is written NAME(INPUT), as in arith(1+1), but was '" + clip(s) + "'");
    }
    String head = s.substring(0, paren).strip();
    String input = s.substring(paren + 1, s.length() - 1).strip();
    if (input.length() > MAX_INPUT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a call's input is at most " + MAX_INPUT + " characters");
    }
    int at = head.indexOf('@');
    String name = at < 0 ? head : head.substring(0, at);
    if (!ToolId.isValidName(name)) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "'" + clip(name) + "' is not a tool name (lower-case letters, digits, _)");
    }
    if (at < 0) {
      return new CallText(name, OptionalInt.empty(), input);
    }
    try {
      return new CallText(name, OptionalInt.of(ToolId.parseVersion(head.substring(at + 1))), input);
    } catch (IllegalArgumentException e) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "the version in '" + clip(head) + "' must be a positive whole number");
    }
  }

  /** The call as text again: {@code NAME(INPUT)} or {@code NAME@VERSION(INPUT)}. */
  @Override
  public String toString() {
    return tool + (version.isPresent() ? "@" + version.getAsInt() : "") + "(" + input + ")";
  }

  private static String clip(String s) {
    return s.length() <= 40 ? s : s.substring(0, 37) + "...";
  }
}
