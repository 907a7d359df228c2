package reckoner.arith;

import java.math.BigDecimal;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.DecimalText;
import reckoner.tool.ErrorCode;
import reckoner.tool.Rounding;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code arith@1}: rounded decimal arithmetic on one expression. See
 * {@code tool-specs/arith/1.json} for the grammar, limits and worked examples. Immutable and
 * thread-safe.
 */
public final class ArithTool implements Tool {
  public static final ToolId ID = ToolId.of("arith", 1);
  static final int DEFAULT_PLACES = 2;

  @Override
  public ToolId id() {
    return ID;
  }

  /** Canonical form: {@code expr} (trimmed), exactly one of {@code places}/{@code digits}, {@code rounding}, {@code pad_zeros}. */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    Optional<String> text = args.string(Arguments.TEXT);
    Arguments structured = text.isPresent() ? args.without(Arguments.TEXT).with("expr", text.get()) : args;
    String expr = structured.requireString("expr").strip();
    Optional<Integer> places = structured.integer("places");
    Optional<Integer> digits = structured.integer("digits");
    if (places.isPresent() && digits.isPresent()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either places or digits, not both");
    }
    Arguments.Builder canonical = Arguments.builder()
        .put("expr", expr)
        .put("rounding", Rounding.require(structured.string("rounding").orElse("half_even")).wireName())
        .put("pad_zeros", structured.bool("pad_zeros").orElse(false));
    return (digits.isPresent()
        ? canonical.put("digits", digits.get())
        : canonical.put("places", places.orElse(DEFAULT_PLACES))).build();
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    BigDecimal exact = Evaluator.evaluate(canonical.requireString("expr"));
    Rounding rounding = Rounding.require(canonical.requireString("rounding"));
    Optional<Integer> digits = canonical.integer("digits");
    BigDecimal rounded = digits.isPresent()
        ? DecimalText.roundToDigits(exact, digits.get(), rounding)
        : DecimalText.roundToPlaces(exact, canonical.integer("places").orElse(DEFAULT_PLACES), rounding);
    return Answer.of(DecimalText.format(rounded, canonical.bool("pad_zeros").orElse(false)));
  }
}
