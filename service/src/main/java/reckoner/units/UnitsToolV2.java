package reckoner.units;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
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
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code units@2}: unit conversion that answers what models and people write. Over the table
 * {@code units/units-2.tsv} and the parser and exact arithmetic of units@1, it reads everyday names
 * by a documented default for the call's {@code system} ({@code us} unless asked: {@code cup} is
 * the US cup, {@code hp} the mechanical horsepower, {@code BTU} the International Table Btu),
 * quantities in parts ({@code 5 ft 11 in}) and targets in parts ({@code to ft+in}), fractions
 * ({@code 1/2 cup}), question and arrow forms, a bare {@code F} or {@code C} beside a temperature,
 * and case slips that have one reading ({@code KM}). Every reading taken is stated in the answer's
 * note; a phrase with two readings is refused, listing them, and every refusal names the nearest
 * phrase that is answered. See {@code tool-specs/units/2.json}. Immutable and thread-safe.
 */
public final class UnitsToolV2 implements Tool {
  public static final ToolId ID = ToolId.of("units", 2);
  static final String DEFAULT_SYSTEM = SystemReadings.US;
  private static final int CACHE_LIMIT = 4096;
  /** Longest string argument read at all; longer ones are refused before any work. */
  private static final int MAX_ARGUMENT = 2000;

  private final UnitTable table;
  private final Resolver resolver;
  /** Readings by system, quantity units and target units: a {@link Resolver.Resolution} or the ToolException it gave. */
  private final Map<String, Object> resolutions = new ConcurrentHashMap<>();

  public UnitsToolV2() {
    this(UnitTable.version2());
  }

  UnitsToolV2(UnitTable table) {
    this.table = table;
    this.resolver = new Resolver(table);
  }

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: {@code value} (a number, or a fraction {@code "n/d"} that has no exact
   * decimal) and {@code from}, or {@code quantity} for a quantity in parts ({@code "5 ft 11 in"});
   * {@code to} (parts joined by {@code +}); {@code system}; exactly one of {@code digits}
   * (default 6) or {@code places}; {@code rounding}; {@code pad_zeros}. Units are kept as written,
   * cleaned ({@code sq. ft.} is {@code sq ft}); the readings are taken again from them.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    return canonicalize(args, true);
  }

  private Arguments canonicalize(Arguments args, boolean nearest) throws ToolException {
    Optional<String> text = args.string(Arguments.TEXT);
    boolean simple = args.has("value") || args.has("from");
    boolean parts = args.has("quantity");
    if (text.isPresent() && (simple || parts || args.has("to"))) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either text, or value, from and to, or quantity and"
          + " to, not several");
    }
    if (simple && parts) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either value and from, or quantity, not both");
    }
    String system = system(args);
    Optional<Integer> places = args.integer("places");
    Optional<Integer> digits = args.integer("digits");
    if (places.isPresent() && digits.isPresent()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either places or digits, not both");
    }
    if (digits.isPresent() && (digits.get() < 1 || digits.get() > 34)) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "digits must be from 1 to 34 but was " + digits.get());
    }
    if (places.isPresent() && (places.get() < -20 || places.get() > 40)) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "places must be from -20 to 40 but was " + places.get());
    }
    String rounding = Rounding.require(args.string("rounding").orElse("half_even")).wireName();
    boolean pad = args.bool("pad_zeros").orElse(false);
    if (!text.isPresent() && !args.has("to")) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "argument 'to' is required");
    }
    Phrasing.Call call;
    try {
      call = read(args, text, system);
      resolve(system, call.quantity().units(), call.to());
    } catch (ToolException e) {
      throw refusal(e, phraseOf(args), system, nearest);
    }
    Arguments.Builder canonical = Arguments.builder();
    Quantity q = call.quantity();
    if (q.isSimple()) {
      canonical.put("value", Amounts.canonical(q.parts().get(0).value())).put("from", q.parts().get(0).unit());
    } else {
      canonical.put("quantity", q.canonical());
    }
    canonical.put("to", String.join("+", call.to())).put("system", system).put("rounding", rounding)
        .put("pad_zeros", pad);
    if (places.isPresent()) {
      canonical.put("places", places.get());
    } else {
      canonical.put("digits", digits.orElse(UnitsTool.DEFAULT_DIGITS));
    }
    return canonical.build();
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    String system = system(canonical);
    try {
      return answer(canonical, system);
    } catch (ToolException e) {
      throw refusal(e, phraseOf(canonical), system, true);
    }
  }

  private Answer answer(Arguments canonical, String system) throws ToolException {
    Quantity q;
    if (canonical.has("quantity")) {
      q = Quantity.parse(canonical.requireString("quantity"), table, this::readable);
    } else {
      q = Quantity.of(value(canonical.asMap().get("value")), canonical.requireString("from"));
    }
    List<String> to = split(canonical.requireString("to"));
    Resolver.Resolution r = resolve(system, q.units(), to);
    Unit fromUnit = r.from().get(r.from().size() - 1);
    Unit toUnit = r.to().get(r.to().size() - 1);
    Factor exact = Converter.convert(total(q, r), fromUnit, q.parts().get(q.parts().size() - 1).unit(), toUnit,
        to.get(to.size() - 1));
    Rounding rounding = Rounding.require(canonical.requireString("rounding"));
    Optional<Integer> places = canonical.integer("places");
    int digits = canonical.integer("digits").orElse(UnitsTool.DEFAULT_DIGITS);
    boolean pad = canonical.bool("pad_zeros").orElse(false);
    String text;
    if (to.size() == 1) {
      BigDecimal rounded = places.isPresent()
          ? Rounder.toPlaces(exact, places.get(), rounding.mode())
          : Breakdown.padded(Rounder.toDigits(exact, digits, rounding.mode()), digits);
      text = DecimalText.format(rounded, pad) + " " + r.toWritten().get(0);
    } else {
      text = Breakdown.format(exact, r.to(), r.toWritten(), places, digits, rounding.mode(), pad);
    }
    if (text.length() > ResultText.DEFAULT_MAX_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the answer would be " + text.length()
          + " characters long; the limit is " + ResultText.DEFAULT_MAX_LENGTH + " (ask for fewer places or digits)");
    }
    Answer answer = Answer.of(text);
    return r.note() == null ? answer : answer.withNote(r.note());
  }

  /** The quantity's value in its last part's unit: the parts summed exactly, the sign of the first on the whole. */
  private static Rational total(Quantity q, Resolver.Resolution r) {
    if (q.isSimple()) {
      return q.parts().get(0).value();
    }
    Factor last = r.from().get(r.from().size() - 1).factor();
    Rational sum = Rational.ZERO;
    for (int i = 0; i < q.parts().size(); i++) {
      Rational v = q.parts().get(i).value();
      Rational ratio = r.from().get(i).factor().divide(last).coefficient(); // rational: checked by the resolver
      sum = sum.plus((v.signum() < 0 ? v.negate() : v).times(ratio));
    }
    return q.parts().get(0).value().signum() < 0 ? sum.negate() : sum;
  }

  // ---- reading the arguments ----------------------------------------------------------------------

  private Phrasing.Call read(Arguments args, Optional<String> text, String system) throws ToolException {
    if (text.isPresent()) {
      String t = text.get();
      if (t.length() > 4 * Phrasing.MAX_TEXT) {
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the text may have at most " + Phrasing.MAX_TEXT
            + " characters but has " + t.length());
      }
      UnitText.requireVisible(t, "the text");
      return Phrasing.parse(t, table, probe(system));
    }
    String toText = bounded(args, "to");
    List<String> to = Phrasing.targetParts(toText, table);
    if (args.has("quantity")) {
      return new Phrasing.Call(Quantity.parse(bounded(args, "quantity"), table, this::readable), to);
    }
    Object raw = args.asMap().get("value");
    if (raw == null) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "argument 'value' is required");
    }
    Rational value;
    if (raw instanceof String s) {
      UnitText.requireVisible(s, "value");
      if (s.length() > MAX_ARGUMENT) {
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "value may have at most " + MAX_ARGUMENT + " characters");
      }
      value = Amounts.whole(UnitText.prepare(s));
    } else {
      value = number(args.requireNumber("value"));
    }
    String from = UnitText.cleanUnit(bounded(args, "from"), table);
    if (from.isEmpty()) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "argument 'from' must name a unit");
    }
    return new Phrasing.Call(Quantity.of(value, from.startsWith("/") ? "1" + from : from), to);
  }

  private static String bounded(Arguments args, String name) throws ToolException {
    String s = args.requireString(name);
    if (s.length() > MAX_ARGUMENT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "'" + name + "' may have at most " + MAX_ARGUMENT
          + " characters but has " + s.length());
    }
    UnitText.requireVisible(s, "'" + name + "'");
    return s;
  }

  private static Rational number(BigDecimal v) throws ToolException {
    if (v.signum() != 0 && Math.abs((long) v.precision() - v.scale() - 1) > Amounts.MAX_EXPONENT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "value must be within 1e±" + Amounts.MAX_EXPONENT);
    }
    if (v.precision() > Amounts.MAX_DIGITS) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "value may have at most " + Amounts.MAX_DIGITS
          + " significant digits but has " + v.precision());
    }
    return Rational.of(v);
  }

  /** A canonical value: a number, or a fraction {@code "n/d"}. */
  private static Rational value(Object raw) throws ToolException {
    return raw instanceof String s ? Amounts.whole(s) : Rational.of((BigDecimal) raw);
  }

  private static String system(Arguments args) throws ToolException {
    String system = args.string("system").orElse(DEFAULT_SYSTEM);
    if (!SystemReadings.SYSTEMS.contains(system)) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "system must be one of " + SystemReadings.SYSTEMS
          + " but was '" + ResultText.clean(system, 40) + "'");
    }
    return system;
  }

  /** The parts of a canonical target, joined by {@code +}. */
  private static List<String> split(String to) {
    List<String> out = new ArrayList<>(2);
    int start = 0;
    for (int i = to.indexOf('+'); i >= 0; i = to.indexOf('+', start)) {
      out.add(to.substring(start, i));
      start = i + 1;
    }
    out.add(to.substring(start));
    return out;
  }

  // ---- reading the units --------------------------------------------------------------------------

  private Resolver.Resolution resolve(String system, List<String> from, List<String> to) throws ToolException {
    String key = system + '\u0001' + String.join("\u0002", from) + '\u0001' + String.join("\u0002", to);
    Object cached = resolutions.get(key);
    if (cached == null) {
      try {
        cached = resolver.resolve(system, from, to);
      } catch (ToolException e) {
        cached = e;
      }
      if (resolutions.size() >= CACHE_LIMIT) {
        resolutions.clear(); // a plain bound; reading again gives the same result
      }
      resolutions.put(key, cached);
    }
    if (cached instanceof ToolException e) {
      throw e; // created without a stack trace, so it may be thrown again
    }
    return (Resolver.Resolution) cached;
  }

  private boolean readable(String unit) {
    try {
      UnitParser.parse(unit, table, new SystemReadings(table, resolver.caseIndex(), DEFAULT_SYSTEM, null));
      return true;
    } catch (ToolException e) {
      return e.error().code() == ErrorCode.AMBIGUOUS_UNIT;
    }
  }

  private Phrasing.Probe probe(String system) {
    return new Phrasing.Probe() {
      @Override
      public ToolException check(Quantity quantity, List<String> to) {
        try {
          resolve(system, quantity.units(), to);
          return null;
        } catch (ToolException e) {
          return e;
        }
      }

      @Override
      public boolean readable(String unit) {
        return UnitsToolV2.this.readable(unit);
      }
    };
  }

  // ---- refusals -----------------------------------------------------------------------------------

  /**
   * The refusal as callers see it: a caller's text that cannot be read or computed is a 422 code
   * (syntax_error where the shared grammar says invalid_argument), and the detail names the
   * nearest phrase that is answered, where one is found.
   */
  private ToolException refusal(ToolException e, String phrase, String system, boolean nearest) {
    ToolError error = e.error();
    ErrorCode code = error.code() == ErrorCode.INVALID_ARGUMENT ? ErrorCode.SYNTAX_ERROR : error.code();
    String detail = error.detail();
    if (nearest && phrase != null && (code == ErrorCode.SYNTAX_ERROR || code == ErrorCode.UNKNOWN_UNIT
        || code == ErrorCode.AMBIGUOUS_UNIT || code == ErrorCode.DIMENSION_MISMATCH)) {
      ToolError asSeen = new ToolError(code, detail, error.suggestions());
      Optional<String> near = Nearest.phrase(phrase, asSeen, candidate -> answers(candidate, system));
      if (code == ErrorCode.DIMENSION_MISMATCH && (detail.contains("volume to mass") || detail.contains("mass to volume"))) {
        detail += "; volume and mass convert only through a density, which depends on the substance";
      }
      if (near.isPresent()) {
        detail += "; try '" + near.get() + "'";
      }
    }
    ToolError refused = new ToolError(code, detail, error.suggestions());
    if (refused.text().endsWith("…")) { // too long for one line: the readings by symbol alone
      refused = new ToolError(code, withoutNames(detail), error.suggestions());
    }
    return new ToolException(refused);
  }

  /** {@code 'ton' is ambiguous: t (tonne) or ...} without the parenthesized names of the readings. */
  static String withoutNames(String detail) {
    int from = detail.indexOf(" is ambiguous: ");
    if (from < 0) {
      return detail;
    }
    int to = detail.indexOf(';', from);
    to = to < 0 ? detail.length() : to;
    StringBuilder sb = new StringBuilder(detail.substring(0, from));
    int depth = 0;
    for (int i = from; i < to; i++) {
      char c = detail.charAt(i);
      if (c == '(' && i > 0 && detail.charAt(i - 1) == ' ') {
        depth++;
        sb.setLength(sb.length() - 1);
      } else if (c == ')' && depth > 0) {
        depth--;
      } else if (depth == 0) {
        sb.append(c);
      }
    }
    return sb.append(detail, to, detail.length()).toString();
  }

  /** Whether {@code text} is answered under {@code system}; asks for no nearest phrase itself. */
  private boolean answers(String text, String system) {
    try {
      Arguments canonical = canonicalize(Arguments.of(Map.of(Arguments.TEXT, text, "system", system)), false);
      answer(canonical, system);
      return true;
    } catch (ToolException e) {
      return false;
    }
  }

  /** The call written as a text phrase, for naming a nearest phrase; null when it cannot be written. */
  private static String phraseOf(Arguments args) {
    Map<String, Object> m = args.asMap();
    if (m.get(Arguments.TEXT) instanceof String t) {
      return t;
    }
    Object to = m.get("to");
    if (!(to instanceof String)) {
      return null;
    }
    if (m.get("quantity") instanceof String q) {
      return q + " to " + to;
    }
    Object value = m.get("value");
    Object from = m.get("from");
    if (value == null || !(from instanceof String)) {
      return null;
    }
    String v = value instanceof BigDecimal d ? DecimalText.format(d, false) : value.toString();
    return v + " " + from + " to " + to;
  }
}
