package reckoner.dates;

import java.util.Map;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code dates@2}: version 1's calendar and duration arithmetic, and the phrasings models and
 * people write: relative days and weekdays against the reference time ({@code yesterday},
 * {@code in 3 days}, {@code next Friday}, {@code days until 2024-12-25}), period edges
 * ({@code end of month}), the nth weekday of a month, English month names, business days with the
 * public holidays of a region, city names for zones, and calendar facts asked as questions. See
 * {@code tool-specs/dates/2.json} for every phrasing, its convention and the worked examples.
 * Version 1 ({@link DatesTool}) keeps its answers. Immutable and thread-safe.
 */
public final class DatesToolV2 implements Tool {
  public static final ToolId ID = ToolId.of("dates", 2);

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: version 1's for its ops (after reading English dates and city names), and the
   * new ops' own; the text form is read into the same structured arguments first.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    Arguments structured = args.has(Arguments.TEXT) ? merge(args) : args;
    return CanonicalFormV2.of(structured);
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    return AnswersV2.of(canonical, context);
  }

  /** Answers that used a region's holidays name the holiday rules' version. */
  @Override
  public void warmUp() {
    Holidays.warmUp(); // the holiday rules' XML binding starts in about a second the first time
  }

  @Override
  public Optional<String> dataVersion(Arguments canonical) {
    return canonical.has(CanonicalFormV2.REGION) ? Optional.of(Holidays.DATA_VERSION) : Optional.empty();
  }

  /** {@code args} with its {@code text} replaced by the structured arguments it spells. */
  private static Arguments merge(Arguments args) throws ToolException {
    for (String name : new String[] {CanonicalForm.OP, CanonicalForm.DATE, CanonicalForm.TO, CanonicalForm.DURATION,
        CanonicalForm.UNIT, CanonicalForm.CALENDAR, CanonicalFormV2.WEEKDAY, CanonicalFormV2.WHICH, CanonicalFormV2.N,
        CanonicalFormV2.PERIOD, CanonicalFormV2.SHIFT, CanonicalFormV2.DAYS}) {
      if (args.has(name)) {
        throw Problems.invalidArgument("give either text or '" + name + "', not both: the text already says what to compute");
      }
    }
    Map<String, Object> spelled = Phrases.read(args.requireString(Arguments.TEXT));
    for (String name : new String[] {CanonicalForm.ZONE, CanonicalFormV2.REGION}) {
      if (spelled.containsKey(name) && args.has(name)) {
        throw Problems.invalidArgument("the text names a " + name + " and so does '" + name + "'; give it once");
      }
    }
    Arguments out = args.without(Arguments.TEXT);
    for (Map.Entry<String, Object> e : spelled.entrySet()) {
      out = out.with(e.getKey(), e.getValue());
    }
    return out;
  }
}
