package reckoner.arith;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.DecimalText;
import reckoner.tool.ErrorCode;
import reckoner.tool.Rounding;
import reckoner.tool.Tool;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code arith@2}: arithmetic as people and models write it — words around and inside the
 * expression, percentages, {@code mod}, {@code **}, superscripts, roots, factorials — evaluated
 * exactly on rationals and rounded once, at the end. See {@code tool-specs/arith/2.json} for the
 * phrasings, semantics and limits. The canonical form of a call is the expression printed back
 * in plain notation ({@code "what is 25 times 4?"} becomes {@code 25 * 4}), so every spelling of
 * one computation shares one cache entry and one ledger form. Immutable and thread-safe.
 */
public final class ArithToolV2 implements Tool {
  public static final ToolId ID = ToolId.of("arith", 2);
  static final int DEFAULT_PLACES = 2;
  /** Working precisions of the bounded evaluation, in significant digits; the last is the limit. */
  private static final int FIRST_PRECISION = 50;
  static final int MAX_PRECISION = 2_000;

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: {@code expr} (the phrase printed as a plain expression), exactly one of
   * {@code places}/{@code digits}, {@code rounding}, {@code pad_zeros}. A rounding the phrase asks
   * for in words ("to 3 decimal places") moves into {@code places}/{@code digits}/{@code rounding}.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    Optional<String> text = args.string(Arguments.TEXT);
    Arguments structured = text.isPresent() ? args.without(Arguments.TEXT).with("expr", text.get()) : args;
    String expr = structured.requireString("expr");
    Optional<Integer> places = structured.integer("places");
    Optional<Integer> digits = structured.integer("digits");
    Optional<String> rounding = structured.string("rounding");
    if (places.isPresent() && digits.isPresent()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "give either places or digits, not both");
    }
    PhraseParser.Parsed parsed = read(expr);
    if (parsed.places().isPresent() || parsed.digits().isPresent()) {
      String asked = parsed.places().isPresent() ? parsed.places().get() + " decimal places"
          : parsed.digits().get() + " significant digits";
      boolean same = parsed.places().isPresent() ? digits.isEmpty() && places.orElse(parsed.places().get()).equals(parsed.places().get())
          : places.isEmpty() && digits.orElse(parsed.digits().get()).equals(parsed.digits().get());
      if (!same) {
        throw new ToolException(ErrorCode.INVALID_ARGUMENT, "the text asks for " + asked + " but the arguments say "
            + (places.isPresent() ? "places " + places.get() : "digits " + digits.get()) + "; give one of them");
      }
      places = parsed.places();
      digits = parsed.digits();
    }
    if (parsed.rounding().isPresent()) {
      if (rounding.isPresent() && !rounding.get().equals(parsed.rounding().get())) {
        throw new ToolException(ErrorCode.INVALID_ARGUMENT, "the text asks for rounding " + parsed.rounding().get()
            + " but the arguments say " + Rounding.require(rounding.get()).wireName() + "; give one of them");
      }
      rounding = parsed.rounding();
    }
    Arguments.Builder canonical = Arguments.builder()
        .put("expr", Canonical.print(parsed.expr()))
        .put("rounding", Rounding.require(rounding.orElse("half_even")).wireName())
        .put("pad_zeros", structured.bool("pad_zeros").orElse(false));
    return (digits.isPresent()
        ? canonical.put("digits", digits.get())
        : canonical.put("places", places.orElse(DEFAULT_PLACES))).build();
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    Node expr = readCanonical(canonical.requireString("expr"));
    Rounding rounding = Rounding.require(canonical.requireString("rounding"));
    Optional<Integer> digits = canonical.integer("digits");
    int places = canonical.integer("places").orElse(DEFAULT_PLACES);
    BigDecimal rounded;
    try {
      Rational exact = ExactEvaluator.evaluate(expr);
      rounded = digits.isPresent() ? toDigits(exact, digits.get(), rounding) : exact.roundToPlaces(places, rounding.mode());
    } catch (Rational.TooLarge e) {
      rounded = bounded(expr, digits, places, rounding);
    }
    boolean pad = canonical.bool("pad_zeros").orElse(false);
    return Answer.of(DecimalText.format(pad ? rounded : withoutTrailingZeros(rounded), pad));
  }

  /**
   * The value without trailing zeros, found by a binary search on the power of ten that divides it:
   * {@link BigDecimal#stripTrailingZeros()} divides by ten once per zero, which for 3000! (748 of
   * them) costs milliseconds. The same value, so the same text.
   */
  static BigDecimal withoutTrailingZeros(BigDecimal value) {
    BigInteger unscaled = value.unscaledValue();
    if (unscaled.signum() == 0) {
      return BigDecimal.ZERO;
    }
    int most = unscaled.getLowestSetBit(); // a factor 10^k needs 2^k
    if (most == 0 || unscaled.mod(BigInteger.TEN).signum() != 0) {
      return value;
    }
    int lo = 1;
    int hi = most;
    while (lo < hi) { // the largest k with 10^k dividing unscaled lies in [lo, hi]
      int mid = (lo + hi + 1) >>> 1;
      if (unscaled.mod(BigInteger.TEN.pow(mid)).signum() == 0) {
        lo = mid;
      } else {
        hi = mid - 1;
      }
    }
    return new BigDecimal(unscaled.divide(BigInteger.TEN.pow(lo)), value.scale() - lo);
  }

  /** Rounds to significant digits, padded to that many digits like arith@1. */
  private static BigDecimal toDigits(Rational exact, int digits, Rounding rounding) {
    Optional<BigDecimal> decimal = exact.toExactDecimal();
    if (decimal.isPresent()) {
      return DecimalText.roundToDigits(decimal.get(), digits, rounding);
    }
    BigDecimal r = exact.round(new MathContext(digits, rounding.mode()));
    return r.precision() < digits ? r.setScale(r.scale() + digits - r.precision()) : r;
  }

  /**
   * The correctly rounded result of a tree too large to evaluate exactly: bounds at growing
   * precision until both round alike, or limit_exceeded.
   */
  private static BigDecimal bounded(Node expr, Optional<Integer> digits, int places, Rounding rounding) throws ToolException {
    int precision = FIRST_PRECISION;
    while (true) {
      try {
        BoundedEvaluator.Bounds b = new BoundedEvaluator(precision).evaluate(expr);
        BigDecimal lo;
        BigDecimal hi;
        if (digits.isPresent()) {
          lo = DecimalText.roundToDigits(b.lo(), digits.get(), rounding);
          hi = DecimalText.roundToDigits(b.hi(), digits.get(), rounding);
        } else {
          lo = b.lo().setScale(places, rounding.mode());
          hi = b.hi().setScale(places, rounding.mode());
        }
        if (lo.compareTo(hi) == 0 && lo.scale() == hi.scale()) {
          return hi;
        }
        precision = nextPrecision(precision, b, digits, places);
      } catch (BoundedEvaluator.Undecided e) {
        precision = nextPrecision(precision, null, digits, places);
      }
      if (precision < 0) {
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the exact result is too large to compute and lies too close"
            + " to a rounding boundary to decide within " + MAX_PRECISION + " digits");
      }
    }
  }

  /**
   * The next working precision: bounds that are {@code w} apart at precision p are about
   * {@code w * 10^(p - next)} apart at the next, so the precision that narrows them below the
   * asked rounding's step is estimated from them; at least four times the current one; -1 when
   * even the limit would not do (catastrophic cancellation), so hopeless cases stop early.
   */
  private static int nextPrecision(int current, BoundedEvaluator.Bounds b, Optional<Integer> digits, int places) {
    if (current >= MAX_PRECISION) {
      return -1;
    }
    int next = current * 4;
    if (b != null && b.hi().compareTo(b.lo()) > 0) {
      BigDecimal width = b.hi().subtract(b.lo());
      BigDecimal magnitude = b.hi().abs().max(b.lo().abs());
      int step = digits.isPresent() ? DecimalMath.exponentOf(magnitude) - digits.get() + 1 : -places;
      int needed = current + (DecimalMath.exponentOf(width) - step) + 10;
      if (needed > MAX_PRECISION) {
        return -1;
      }
      next = Math.max(next, needed);
    }
    return Math.min(next, MAX_PRECISION);
  }

  // ---- reading the phrase ----

  private static PhraseParser.Parsed read(String expr) throws ToolException {
    try {
      return PhraseParser.parse(expr, PhraseParser.Limits.CALLER, PhraseParser.Readings.refuseAll());
    } catch (PhraseParser.Ambiguous a) {
      throw new ToolException(new ToolError(ErrorCode.SYNTAX_ERROR, "ambiguous: " + a.getMessage()
          + "; write one of the readings", readings(expr, a.kind)));
    } catch (PhraseParser.UnknownWord u) {
      throw new ToolException(new ToolError(ErrorCode.SYNTAX_ERROR, u.getMessage(), withoutUnknownWords(expr, u)));
    }
  }

  private static Node readCanonical(String expr) throws ToolException {
    try {
      return PhraseParser.parse(expr, PhraseParser.Limits.CANONICAL, PhraseParser.Readings.refuseAll()).expr();
    } catch (PhraseParser.Ambiguous | PhraseParser.UnknownWord e) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, e.getMessage()); // not a canonical expression
    }
  }

  /** Both readings of an ambiguous phrase, printed canonically; empty if either cannot be printed. */
  private static List<String> readings(String expr, PhraseParser.Ambiguity kind) {
    List<String> out = new ArrayList<>(2);
    for (PhraseParser.Choice c : new PhraseParser.Choice[] {PhraseParser.Choice.FIRST, PhraseParser.Choice.SECOND}) {
      try {
        out.add(Canonical.print(PhraseParser.parse(expr, PhraseParser.Limits.CALLER,
            PhraseParser.Readings.refuseAll().with(kind, c)).expr()));
      } catch (ToolException | PhraseParser.Ambiguous | PhraseParser.UnknownWord e) {
        return List.of();
      }
    }
    return out;
  }

  /** The phrase with its unknown words left out, if that reads: the nearest phrase that works. */
  private static List<String> withoutUnknownWords(String expr, PhraseParser.UnknownWord first) {
    String text = expr;
    PhraseParser.UnknownWord u = first;
    for (int attempt = 0; attempt < 5; attempt++) {
      String word = text.substring(u.start, u.end);
      // "a 15% tip on $60": without the unknown noun, "on" says what "of" says.
      text = text.substring(0, u.start) + (word.equalsIgnoreCase("on") ? " of " : " ") + text.substring(u.end);
      try {
        return List.of(Canonical.print(PhraseParser.parse(text, PhraseParser.Limits.CALLER,
            PhraseParser.Readings.refuseAll()).expr()));
      } catch (PhraseParser.UnknownWord next) {
        u = next;
      } catch (ToolException | PhraseParser.Ambiguous e) {
        return List.of();
      }
    }
    return List.of();
  }
}
