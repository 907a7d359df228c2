package reckoner.units;

import java.math.BigDecimal;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.DecimalText;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.Rounding;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code units@1}: exact unit conversion over the unit table {@code units/units-1.tsv}. See
 * {@code tool-specs/units/1.json} for the grammar, the table's defaults for ambiguous names, the
 * limits and worked examples. Immutable and thread-safe.
 */
public final class UnitsTool implements Tool {
  public static final ToolId ID = ToolId.of("units", 1);
  static final int DEFAULT_DIGITS = 6;
  /** Values beyond 1e±1000 are refused: nothing measured needs them, and they would cost time. */
  static final int MAX_VALUE_EXPONENT = 1000;
  private static final int CACHE_LIMIT = 4096;

  private final UnitTable table;
  private final Map<String, Unit> parsed = new ConcurrentHashMap<>();

  public UnitsTool() {
    this(UnitTable.standard());
  }

  UnitsTool(UnitTable table) {
    this.table = table;
  }

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: {@code value} (a number), {@code from} and {@code to} (white space collapsed),
   * exactly one of {@code digits} (default 6) or {@code places}, {@code rounding}, {@code pad_zeros}.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    Arguments structured = args;
    Optional<String> text = args.string(Arguments.TEXT);
    if (text.isPresent()) {
      if (args.has("value") || args.has("from") || args.has("to")) {
        throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either text or value, from and to, not both");
      }
      TextForm.Parsed p = TextForm.parse(text.get(), this::unit);
      structured = args.without(Arguments.TEXT).with("value", p.value()).with("from", p.from()).with("to", p.to());
    }
    BigDecimal value = value(structured);
    Optional<Integer> places = structured.integer("places");
    Optional<Integer> digits = structured.integer("digits");
    if (places.isPresent() && digits.isPresent()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either places or digits, not both");
    }
    if (digits.isPresent() && (digits.get() < 1 || digits.get() > 34)) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "digits must be from 1 to 34 but was " + digits.get());
    }
    if (places.isPresent() && (places.get() < -20 || places.get() > 40)) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "places must be from -20 to 40 but was " + places.get());
    }
    Arguments canonical = Arguments.empty()
        .with("value", value)
        .with("from", unitText(structured, "from"))
        .with("to", unitText(structured, "to"))
        .with("rounding", Rounding.require(structured.string("rounding").orElse("half_even")).wireName())
        .with("pad_zeros", structured.bool("pad_zeros").orElse(false));
    return places.isPresent()
        ? canonical.with("places", places.get())
        : canonical.with("digits", digits.orElse(DEFAULT_DIGITS));
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    String fromText = canonical.requireString("from");
    String toText = canonical.requireString("to");
    Unit from = unit(fromText);
    Unit to = unit(toText);
    Rational value = Rational.of(canonical.requireNumber("value"));
    Factor exact = Converter.convert(value, from, fromText, to, toText);
    Rounding rounding = Rounding.require(canonical.requireString("rounding"));
    Optional<Integer> places = canonical.integer("places");
    BigDecimal rounded = places.isPresent()
        ? Rounder.toPlaces(exact, places.get(), rounding.mode())
        : Rounder.toDigits(exact, canonical.integer("digits").orElse(DEFAULT_DIGITS), rounding.mode());
    String text = DecimalText.format(rounded, canonical.bool("pad_zeros").orElse(false)) + " " + toText;
    if (text.length() > ResultText.DEFAULT_MAX_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the answer would be " + text.length()
          + " characters long; the limit is " + ResultText.DEFAULT_MAX_LENGTH + " (ask for fewer places or digits)");
    }
    return Answer.of(text);
  }

  private Unit unit(String expression) throws ToolException {
    Unit u = parsed.get(expression);
    if (u == null) {
      u = UnitParser.parse(expression, table);
      if (parsed.size() >= CACHE_LIMIT) {
        parsed.clear(); // a plain bound; parsing again gives the same unit
      }
      parsed.put(expression, u);
    }
    return u;
  }

  private static BigDecimal value(Arguments args) throws ToolException {
    Object raw = args.asMap().get("value");
    if (raw == null) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "argument 'value' is required");
    }
    BigDecimal v = raw instanceof String s ? TextForm.parseDecimal(s) : args.requireNumber("value");
    if (v.signum() != 0 && Math.abs(v.precision() - v.scale() - 1) > MAX_VALUE_EXPONENT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "value must be within 1e±" + MAX_VALUE_EXPONENT);
    }
    if (v.precision() > 100) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "value may have at most 100 significant digits but has "
          + v.precision());
    }
    return v;
  }

  private static String unitText(Arguments args, String name) throws ToolException {
    String s = args.requireString(name);
    if (s.length() > 10 * UnitParser.MAX_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a unit expression may have at most "
          + UnitParser.MAX_LENGTH + " characters but '" + name + "' has " + s.length());
    }
    String clean = ResultText.clean(s, Math.max(1, s.length()));
    if (clean.isEmpty()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "argument '" + name + "' must name a unit");
    }
    return clean;
  }
}
