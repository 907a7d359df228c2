package reckoner.dates;

import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code dates@1}: calendar and duration arithmetic against a reference time ({@code as_of}),
 * moves between IANA time zones, and dates in other calendar systems. See
 * {@code tool-specs/dates/1.json} for the operations, the text form, the rules and worked
 * examples. Immutable and thread-safe.
 */
public final class DatesTool implements Tool {
  public static final ToolId ID = ToolId.of("dates", 1);

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: {@code op} and the op's own arguments, normalised, with {@code unit} and
   * {@code style} filled in; the text form is read into the same structured arguments first.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    Arguments structured = args.has(Arguments.TEXT) ? TextForm.merge(args) : args;
    return CanonicalForm.of(structured);
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    return Answers.of(canonical, context);
  }
}
