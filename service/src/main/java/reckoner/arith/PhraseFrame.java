package reckoner.arith;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import reckoner.arith.PhraseLexer.Kind;
import reckoner.arith.PhraseLexer.Lexeme;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * The frame around an arith@2 expression: the words that ask for a result and say nothing about
 * it (what is, calculate, ?), the rounding a phrase asks for in words (to 3 decimal places, to the
 * nearest tenth, rounded up, round(x, 2)) and currency signs next to numbers. What remains is the
 * expression, for {@link PhraseParser}. Not thread-safe; one instance frames one text.
 */
final class PhraseFrame {
  /** The expression's lexemes and the rounding the phrase asked for (empty where it asked none). */
  record Framed(List<Lexeme> expression, Optional<Integer> places, Optional<Integer> digits, Optional<String> rounding) {
    Framed {
      expression = List.copyOf(expression);
    }
  }

  /** Leading words that ask for a result and say nothing about it. */
  private static final List<List<String>> LEADING_FILLER = List.of(
      List.of("what", "is"), List.of("what's"), List.of("whats"), List.of("what", "are"), List.of("what", "does"),
      List.of("what", "do"), List.of("how", "much", "is"), List.of("how", "much", "are"), List.of("how", "much"),
      List.of("calculate"), List.of("compute"), List.of("evaluate"), List.of("work", "out"), List.of("figure", "out"),
      List.of("find"), List.of("solve"), List.of("simplify"), List.of("determine"), List.of("please"),
      List.of("can", "you"), List.of("could", "you"), List.of("would", "you"), List.of("will", "you"),
      List.of("tell", "me"), List.of("give", "me"), List.of("show", "me"), List.of("i", "need"), List.of("i", "want"),
      List.of("value", "of"), List.of("result", "of"), List.of("answer", "to"), List.of("answer", "of"),
      List.of("hey"), List.of("ok"), List.of("okay"), List.of("quick", "question"), List.of("quickly"), List.of("convert"));

  private static final List<List<String>> TRAILING_FILLER = List.of(
      List.of("is", "equal", "to"), List.of("equal", "to"), List.of("equals"), List.of("equal"),
      List.of("please"), List.of("for", "me"), List.of("exactly"), List.of("?"), List.of("."), List.of("="),
      List.of(";"), List.of("…"), List.of("thanks"), List.of("thank", "you"), List.of("thx"), List.of("is"), List.of("are"));

  /** The words that can start a leading filler and end a trailing one: most phrases have none. */
  private static final Set<String> LEADING_STARTS = LEADING_FILLER.stream().map(f -> f.get(0)).collect(Collectors.toUnmodifiableSet());
  private static final Set<String> TRAILING_ENDS = TRAILING_FILLER.stream().map(f -> f.get(f.size() - 1))
      .collect(Collectors.toUnmodifiableSet());

  private static final Set<String> CURRENCIES = Set.of("$", "€", "£", "¥", "₹");

  private boolean matches(int at, int limit, List<String> words) {
    if (at + words.size() > limit) {
      return false;
    }
    for (int i = 0; i < words.size(); i++) {
      Lexeme l = toks.get(at + i);
      String w = words.get(i);
      boolean ok = (l.kind() == Kind.WORD || l.kind() == Kind.SYMBOL) && l.text().equals(w);
      if (!ok) {
        return false;
      }
    }
    return true;
  }

  private record RoundCall(int exprEnd, int places) {}

  /** {@code x} or {@code x, n} with n a whole number literal, between {@code from} and {@code close}. */
  private RoundCall roundCall(int from, int close) {
    int d = 0;
    for (int i = from; i < close; i++) {
      Lexeme l = toks.get(i);
      if (l.isSymbol("(")) {
        d++;
      } else if (l.isSymbol(")")) {
        d--;
      } else if (d == 0 && l.isSymbol(",")) {
        boolean negative = i + 1 < close && toks.get(i + 1).isSymbol("-");
        int at = negative ? i + 2 : i + 1;
        if (at == close - 1 && toks.get(at).kind() == Kind.NUMBER && isWhole(toks.get(at).value())
            && toks.get(at).value().compareTo(BigDecimal.valueOf(40)) <= 0) {
          int n = toks.get(at).value().intValueExact();
          return new RoundCall(i, negative ? -n : n);
        }
        return null;
      }
    }
    return new RoundCall(close, 0);
  }

  private record RoundingPhrase(int start, Integer places, Integer digits, String rounding) {}

  /** The rounding phrase that ends the text, if one does; its start is where the expression ends. */
  private RoundingPhrase roundingSuffix(int from, int to) throws ToolException {
    for (int s = from + 1; s < to; s++) {
      RoundingPhrase r = roundingAt(s, to);
      if (r != null) {
        return r;
      }
    }
    return null;
  }

  private RoundingPhrase roundingAt(int s, int to) throws ToolException {
    int i = s;
    boolean paren = false;
    if (toks.get(i).isSymbol(",")) {
      i++;
    } else if (toks.get(i).isSymbol("(")) {
      paren = true;
      i++;
    }
    String mode = null;
    boolean verb = false;
    if (i < to && (toks.get(i).isWord("rounded") || toks.get(i).isWord("round") || toks.get(i).isWord("correct")
        || toks.get(i).isWord("accurate"))) {
      verb = true;
      i++;
      if (i < to && toks.get(i).isWord("off")) {
        i++;
      }
      if (i < to && (toks.get(i).isWord("up") || toks.get(i).isWord("down"))) {
        mode = toks.get(i).isWord("up") ? "ceiling" : "floor";
        i++;
      }
    }
    if (verb && i == to && !paren) {
      return new RoundingPhrase(s, 0, null, mode); // "7/2 rounded up": to a whole number
    }
    if (i < to && (toks.get(i).isWord("to") || toks.get(i).isWord("in") || toks.get(i).isWord("with"))) {
      i++;
    } else if (!paren && !verb) {
      return null;
    }
    int close = paren ? to - 1 : to;
    if (paren && !toks.get(to - 1).isSymbol(")")) {
      return null;
    }
    if (i < close && toks.get(i).isWord("nearest")) {
      i++;
      Integer p = null;
      if (matches(i, close, List.of("whole", "number")) && i + 2 == close) {
        p = 0;
      } else if (i + 1 == close && toks.get(i).kind() == Kind.WORD) {
        p = switch (toks.get(i).text()) {
          case "integer", "unit", "one", "dollar", "euro", "pound" -> 0;
          case "tenth" -> 1;
          case "hundredth", "cent", "penny" -> 2;
          case "thousandth" -> 3;
          case "ten" -> -1;
          case "hundred" -> -2;
          case "thousand" -> -3;
          default -> null;
        };
      }
      return p == null ? null : new RoundingPhrase(s, p, null, mode);
    }
    if (i >= close) {
      return null;
    }
    Integer count = countAt(i);
    if (count == null) {
      return null;
    }
    i++;
    List<String> rest = new ArrayList<>();
    for (int j = i; j < close; j++) {
      rest.add(toks.get(j).text());
    }
    String unit = String.join(" ", rest);
    boolean isPlaces = Set.of("decimal places", "decimal place", "places", "place", "dp", "d . p .", "d . p", "decimals",
        "decimal", "decimal digits", "digits after the decimal point", "digits after decimal point").contains(unit);
    boolean isDigits = Set.of("significant figures", "significant figure", "significant digits", "significant digit",
        "sig figs", "sig fig", "sigfigs", "sf", "s . f .", "s . f", "significant").contains(unit);
    if (!isPlaces && !isDigits) {
      return null;
    }
    if (isPlaces && (count < -20 || count > 40)) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the phrase asks for " + count + " decimal places; places must lie between -20 and 40");
    }
    if (isDigits && (count < 1 || count > 34)) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the phrase asks for " + count + " significant digits; digits must lie between 1 and 34");
    }
    return isPlaces ? new RoundingPhrase(s, count, null, mode) : new RoundingPhrase(s, null, count, mode);
  }

  /** A small whole count written as digits or a word ("2", "two"). */
  private Integer countAt(int i) {
    Lexeme l = toks.get(i);
    if (l.kind() == Kind.NUMBER && isWhole(l.value()) && l.value().compareTo(BigDecimal.valueOf(100)) < 0) {
      return l.value().intValueExact();
    }
    if (l.kind() == Kind.WORD && NumberWords.SMALL_NUMBERS.containsKey(l.text())) {
      return NumberWords.SMALL_NUMBERS.get(l.text());
    }
    return null;
  }

  /** Drops currency signs next to numbers; two different currencies in one phrase are refused. */
  private List<Lexeme> stripCurrencies(List<Lexeme> in) throws ToolException {
    List<Lexeme> out = new ArrayList<>(in.size());
    String seen = null;
    for (int i = 0; i < in.size(); i++) {
      Lexeme l = in.get(i);
      if (l.kind() == Kind.SYMBOL && CURRENCIES.contains(l.text())) {
        boolean beforeNumber = i + 1 < in.size() && in.get(i + 1).kind() == Kind.NUMBER && in.get(i + 1).start() == l.end();
        boolean afterNumber = i > 0 && in.get(i - 1).kind() == Kind.NUMBER;
        if (!beforeNumber && !afterNumber) {
          throw syntax("a currency sign '" + l.text() + "' that is not next to a number", l);
        }
        if (seen != null && !seen.equals(l.text())) {
          throw syntax("the phrase mixes the currencies " + seen + " and " + l.text() + "; arith does not convert money", l);
        }
        seen = l.text();
        continue;
      }
      out.add(l);
    }
    return out;
  }

  private final String text;
  private final List<Lexeme> toks;

  private PhraseFrame(String text, List<Lexeme> toks) {
    this.text = text;
    this.toks = toks;
  }

  /** Splits the phrase {@code lexemes} (of {@code text}) into its expression and the rounding it asks for. */
  static Framed frame(String text, List<Lexeme> lexemes) throws ToolException {
    return new PhraseFrame(text, lexemes).frame();
  }

  private Framed frame() throws ToolException {
    int from = 0;
    int to = toks.size();
    // Framing: leading question words, a leading '=' or ':', trailing punctuation and words.
    boolean changed = true;
    while (changed) {
      changed = false;
      for (List<String> f : from < to && LEADING_STARTS.contains(toks.get(from).text()) ? LEADING_FILLER : List.<List<String>>of()) {
        if (matches(from, to, f)) {
          from += f.size();
          changed = true;
        }
      }
      // "tell me what 15 times 15 is": a bare "what" before the expression (not "what percent").
      if (from + 1 < to && toks.get(from).isWord("what") && !toks.get(from + 1).isWord("percent")
          && !toks.get(from + 1).isWord("percentage")) {
        from++;
        changed = true;
      }
      while (from < to && (toks.get(from).isSymbol("=") || toks.get(from).isSymbol(":") || toks.get(from).isSymbol(","))) {
        from++;
        changed = true;
      }
    }
    changed = true;
    while (changed) {
      changed = false;
      for (List<String> f : to > from && TRAILING_ENDS.contains(toks.get(to - 1).text()) ? TRAILING_FILLER : List.<List<String>>of()) {
        if (to - f.size() > from && matches(to - f.size(), to, f)) {
          to -= f.size();
          changed = true;
        }
      }
    }
    // Rounding asked for in words: "..., to 2 decimal places", "round ... to the nearest tenth".
    Integer places = null;
    Integer digits = null;
    String rounding = null;
    RoundingPhrase suffix = roundingSuffix(from, to);
    if (suffix != null) {
      to = suffix.start;
      places = suffix.places;
      digits = suffix.digits;
      rounding = suffix.rounding;
    }
    if (from < to && toks.get(from).isWord("round") && !(from + 1 < to && toks.get(from + 1).isSymbol("("))) {
      from++;
      if (from < to && toks.get(from).isWord("off")) {
        from++;
      }
      if (from < to && (toks.get(from).isWord("up") || toks.get(from).isWord("down"))) {
        String mode = toks.get(from).isWord("up") ? "ceiling" : "floor";
        if (rounding != null && !rounding.equals(mode)) {
          throw syntax("the phrase asks for two roundings", toks.get(from));
        }
        rounding = mode;
        from++;
      }
      if (places == null && digits == null) {
        places = 0;
      }
    }
    // round(x) and round(x, n) around the whole expression: Python's round, as places.
    if (from + 1 < to && toks.get(from).isWord("round") && toks.get(from + 1).isSymbol("(")) {
      int close = PhraseFrame.matchingParen(toks, from + 1, to);
      if (close == to - 1) {
        RoundCall rc = roundCall(from + 2, close);
        if (rc != null) {
          if (places != null || digits != null) {
            throw syntax("the phrase asks for two roundings", toks.get(from));
          }
          places = rc.places;
          from += 2;
          to = rc.exprEnd;
        }
      }
    }
    List<Lexeme> expression = stripCurrencies(toks.subList(from, to));
    if (expression.isEmpty()) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "the expression is empty");
    }
    return new Framed(expression, Optional.ofNullable(places), Optional.ofNullable(digits), Optional.ofNullable(rounding));
  }

  /** The index of the ')' closing the '(' at {@code open}, or -1. */
  static int matchingParen(List<Lexeme> toks, int open, int limit) {
    int d = 0;
    for (int i = open; i < limit; i++) {
      if (toks.get(i).isSymbol("(")) {
        d++;
      } else if (toks.get(i).isSymbol(")") && --d == 0) {
        return i;
      }
    }
    return -1;
  }

  private ToolException syntax(String what, Lexeme at) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, what + " at position " + (text.codePointCount(0, at.start()) + 1));
  }

  private static boolean isWhole(BigDecimal v) {
    return v.signum() == 0 || v.stripTrailingZeros().scale() <= 0;
  }
}
