package reckoner.arith;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import reckoner.arith.Node.Bin;
import reckoner.arith.Node.Call;
import reckoner.arith.Node.Fn;
import reckoner.arith.Node.Num;
import reckoner.arith.Node.Op;
import reckoner.arith.PhraseLexer.Kind;
import reckoner.arith.PhraseLexer.Lexeme;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Reads an arith@2 phrase — an expression, possibly with the words people and models put around
 * and inside it — into an expression tree and the rounding the phrase asks for. A precedence
 * climbing parser over {@link PhraseLexer} lexemes; see {@code tool-specs/arith/2.json} for the
 * grammar. A phrase with two readings is refused ({@link Ambiguous}) unless the caller picks one
 * through {@link Readings}, which is how the tool prints both readings for the error. Not
 * thread-safe; one instance parses one text.
 */
final class PhraseParser {
  /** The kinds of ambiguity the parser refuses to settle silently. */
  enum Ambiguity {
    /** {@code 6/2(1+2)}: FIRST (6/2)*(1+2), SECOND 6/(2*(1+2)). */
    JUXTAPOSITION_AFTER_DIVISION,
    /** {@code 17 % 5}: FIRST 17 mod 5, SECOND 17% * 5. */
    PERCENT_BETWEEN_NUMBERS,
    /** {@code square root of 16 plus 9}: FIRST sqrt(16) + 9, SECOND sqrt(16 + 9). */
    WORD_OPERAND_EXTENT,
    /** {@code sum of 3 and 4 times 2}: FIRST (3 + 4) * 2, SECOND 3 + 4 * 2. */
    LIST_EXTENT,
    /** {@code log(8, 2)}: FIRST log_2(8), SECOND log_8(2). */
    LOG_ARGUMENT_ORDER,
    /** {@code difference between 3 and 10}: FIRST 3 - 10, SECOND 10 - 3. */
    DIFFERENCE_ORDER
  }

  enum Choice { REFUSE, FIRST, SECOND }

  /** Which reading to take for each kind of ambiguity; unlisted kinds are refused. */
  record Readings(Map<Ambiguity, Choice> choices) {
    Readings {
      choices = Map.copyOf(choices);
    }

    static Readings refuseAll() {
      return new Readings(Map.of());
    }

    Choice of(Ambiguity a) {
      return choices.getOrDefault(a, Choice.REFUSE);
    }

    Readings with(Ambiguity a, Choice c) {
      Map<Ambiguity, Choice> m = new EnumMap<>(Ambiguity.class);
      m.putAll(choices);
      m.put(a, c);
      return new Readings(m);
    }
  }

  /** A phrase with two readings, which the caller must choose between. */
  static final class Ambiguous extends Exception {
    private static final long serialVersionUID = 1L;
    final Ambiguity kind;

    Ambiguous(Ambiguity kind, String detail) {
      super(detail, null, false, false);
      this.kind = kind;
    }
  }

  /** A word the grammar does not know, with its place in the text (char offsets). */
  static final class UnknownWord extends Exception {
    private static final long serialVersionUID = 1L;
    final int start;
    final int end;

    UnknownWord(String detail, int start, int end) {
      super(detail, null, false, false);
      this.start = start;
      this.end = end;
    }
  }

  /** The tree, and the rounding the phrase asked for (empty where it asked for none). */
  record Parsed(Node expr, Optional<Integer> places, Optional<Integer> digits, Optional<String> rounding) {}

  static final int MAX_LENGTH = 1000;
  static final int MAX_DEPTH = 50;

  private static final int ADDITIVE = 10;
  private static final int MULTIPLICATIVE = 20;
  private static final int PREFIX = 30;
  private static final int POWER = 40;
  private static final int POSTFIX = 50;
  /** "as a percentage" applies to everything before it. */
  private static final int WHOLE = 1;

  private static final Map<String, Integer> SMALL_NUMBERS = Map.ofEntries(
      Map.entry("zero", 0), Map.entry("one", 1), Map.entry("two", 2), Map.entry("three", 3), Map.entry("four", 4),
      Map.entry("five", 5), Map.entry("six", 6), Map.entry("seven", 7), Map.entry("eight", 8), Map.entry("nine", 9),
      Map.entry("ten", 10), Map.entry("eleven", 11), Map.entry("twelve", 12), Map.entry("thirteen", 13),
      Map.entry("fourteen", 14), Map.entry("fifteen", 15), Map.entry("sixteen", 16), Map.entry("seventeen", 17),
      Map.entry("eighteen", 18), Map.entry("nineteen", 19), Map.entry("twenty", 20), Map.entry("thirty", 30),
      Map.entry("forty", 40), Map.entry("fifty", 50), Map.entry("sixty", 60), Map.entry("seventy", 70),
      Map.entry("eighty", 80), Map.entry("ninety", 90));
  private static final Map<String, Integer> SCALES = Map.of("thousand", 3, "million", 6, "billion", 9, "trillion", 12);
  /** Fraction words after a count: "two thirds", "a quarter". */
  private static final Map<String, Integer> FRACTION_WORDS = Map.ofEntries(
      Map.entry("half", 2), Map.entry("halves", 2), Map.entry("third", 3), Map.entry("thirds", 3),
      Map.entry("quarter", 4), Map.entry("quarters", 4), Map.entry("fourth", 4), Map.entry("fourths", 4),
      Map.entry("fifth", 5), Map.entry("fifths", 5), Map.entry("sixth", 6), Map.entry("sixths", 6),
      Map.entry("seventh", 7), Map.entry("sevenths", 7), Map.entry("eighth", 8), Map.entry("eighths", 8),
      Map.entry("ninth", 9), Map.entry("ninths", 9), Map.entry("tenth", 10), Map.entry("tenths", 10),
      Map.entry("hundredth", 100), Map.entry("hundredths", 100), Map.entry("thousandth", 1000), Map.entry("thousandths", 1000));
  /** Ordinal words before "root": "fourth root of 16". */
  private static final Map<String, Integer> ORDINAL_WORDS = Map.of(
      "second", 2, "third", 3, "fourth", 4, "fifth", 5, "sixth", 6, "seventh", 7, "eighth", 8, "ninth", 9, "tenth", 10);
  /** One-word function names written as in formulas, and what they mean. */
  private static final Map<String, Fn> FUNCTION_NAMES = Map.ofEntries(
      Map.entry("sqrt", Fn.SQRT), Map.entry("cbrt", Fn.CBRT), Map.entry("abs", Fn.ABS), Map.entry("exp", Fn.EXP),
      Map.entry("ln", Fn.LN), Map.entry("log", Fn.LOG10), Map.entry("lg", Fn.LOG10), Map.entry("log10", Fn.LOG10),
      Map.entry("log2", Fn.LOG2), Map.entry("lb", Fn.LOG2), Map.entry("sin", Fn.SIN), Map.entry("cos", Fn.COS),
      Map.entry("tan", Fn.TAN), Map.entry("asin", Fn.ASIN), Map.entry("acos", Fn.ACOS), Map.entry("atan", Fn.ATAN),
      Map.entry("arcsin", Fn.ASIN), Map.entry("arccos", Fn.ACOS), Map.entry("arctan", Fn.ATAN),
      Map.entry("floor", Fn.FLOOR), Map.entry("ceil", Fn.CEIL), Map.entry("ceiling", Fn.CEIL), Map.entry("trunc", Fn.TRUNC),
      Map.entry("max", Fn.MAX), Map.entry("min", Fn.MIN), Map.entry("rem", Fn.REM), Map.entry("gcd", Fn.GCD),
      Map.entry("lcm", Fn.LCM), Map.entry("root", Fn.ROOT), Map.entry("int", Fn.TRUNC), Map.entry("fabs", Fn.ABS),
      Map.entry("fmod", Fn.REM));
  /** Names of functions spelled as English words, which take "of". */
  private static final Map<String, Fn> FUNCTION_WORDS = Map.ofEntries(
      Map.entry("sine", Fn.SIN), Map.entry("cosine", Fn.COS), Map.entry("tangent", Fn.TAN),
      Map.entry("logarithm", Fn.LOG10), Map.entry("maximum", Fn.MAX), Map.entry("minimum", Fn.MIN));
  private static final Set<String> LIST_WORDS = Set.of("sum", "product", "average", "mean", "avg", "total");
  private static final Set<String> LIST_FUNCTIONS = Set.of("sum", "product", "average", "mean", "avg", "total", "max", "min",
      "gcd", "lcm");
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
  private static final Set<String> CURRENCIES = Set.of("$", "€", "£", "¥", "₹");

  private final String text;
  private final Readings readings;
  private List<Lexeme> toks;
  private int pos;
  private int end;
  private int depth;
  private int parenDepth;
  /** Inside a function's parenthesised arguments: commas separate, never group digits. */
  private boolean inCallArguments;
  /** Inside a word list ("average of 3, 5 and 10"): commas separate. */
  private boolean inWordList;
  /** The position just after the last ')' that closed a group. */
  private int lastGroupEnd = -1;

  private PhraseParser(String text, Readings readings) {
    this.text = text;
    this.readings = readings;
  }

  static Parsed parse(String text, int maxLength, Readings readings) throws ToolException, Ambiguous, UnknownWord {
    if (text.length() > maxLength) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED,
          "the expression is " + text.length() + " characters long; the limit is " + maxLength);
    }
    return new PhraseParser(text, readings).parseAll();
  }

  // =====================================================================================
  // The whole phrase: framing words, the rounding it asks for, currencies, the expression
  // =====================================================================================

  private Parsed parseAll() throws ToolException, Ambiguous, UnknownWord {
    List<Lexeme> all = new ArrayList<>();
    for (Lexeme l : PhraseLexer.lex(text)) {
      if (!l.isWord("the")) {
        all.add(l);
      }
    }
    toks = all;
    int from = 0;
    int to = toks.size();
    // Framing: leading question words, a leading '=' or ':', trailing punctuation and words.
    boolean changed = true;
    while (changed) {
      changed = false;
      for (List<String> f : LEADING_FILLER) {
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
      for (List<String> f : TRAILING_FILLER) {
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
      int close = matchingParen(from + 1, to);
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
    toks = stripCurrencies(toks.subList(from, to));
    if (toks.isEmpty()) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "the expression is empty");
    }
    pos = 0;
    end = toks.size();
    Node expr = expression(0);
    if (pos < end) {
      Lexeme extra = toks.get(pos);
      if (extra.kind() == Kind.WORD) {
        throw new UnknownWord("unexpected word '" + extra.text() + "' at position " + position(extra), extra.start(), extra.end());
      }
      throw unexpected(extra);
    }
    return new Parsed(expr, Optional.ofNullable(places), Optional.ofNullable(digits), Optional.ofNullable(rounding));
  }

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

  private int matchingParen(int open, int limit) {
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
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "the phrase asks for " + count + " decimal places; places must lie between -20 and 40");
    }
    if (isDigits && (count < 1 || count > 34)) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "the phrase asks for " + count + " significant digits; digits must lie between 1 and 34");
    }
    return isPlaces ? new RoundingPhrase(s, count, null, mode) : new RoundingPhrase(s, null, count, mode);
  }

  /** A small whole count written as digits or a word ("2", "two"). */
  private Integer countAt(int i) {
    Lexeme l = toks.get(i);
    if (l.kind() == Kind.NUMBER && isWhole(l.value()) && l.value().compareTo(BigDecimal.valueOf(100)) < 0) {
      return l.value().intValueExact();
    }
    if (l.kind() == Kind.WORD && SMALL_NUMBERS.containsKey(l.text())) {
      return SMALL_NUMBERS.get(l.text());
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

  // =====================================================================================
  // Expressions: precedence climbing
  // =====================================================================================

  private Node expression(int rbp) throws ToolException, Ambiguous, UnknownWord {
    enter();
    try {
      return continueFrom(prefix(), rbp);
    } finally {
      depth--;
    }
  }

  /** Applies infix and postfix operators binding tighter than {@code rbp} to {@code left}. */
  private Node continueFrom(Node left, int rbp) throws ToolException, Ambiguous, UnknownWord {
    Op lastOp = null;
    while (pos < end) {
      Infix in = infix(left);
      if (in == null || in.power <= rbp) {
        break;
      }
      if (in.implicit && (lastOp == Op.DIV || lastOp == Op.MOD) && left instanceof Bin b && b.op() == lastOp) {
        Choice c = readings.of(Ambiguity.JUXTAPOSITION_AFTER_DIVISION);
        if (c == Choice.REFUSE) {
          throw new Ambiguous(Ambiguity.JUXTAPOSITION_AFTER_DIVISION, "a product written without '*' right after '"
              + b.op().symbol + "' can group two ways");
        }
        if (c == Choice.SECOND) {
          pos += in.width;
          Node factor = expression(MULTIPLICATIVE);
          left = new Bin(b.op(), b.left(), new Bin(Op.MUL, b.right(), factor));
          continue;
        }
      }
      pos += in.width;
      left = in.apply(left);
      lastOp = in.op;
    }
    return left;
  }

  /** An infix or postfix operator at {@code pos}, or null. Applying it parses its right side. */
  private abstract class Infix {
    final int power;
    final int width;
    final Op op;
    final boolean implicit;

    Infix(int power, int width, Op op, boolean implicit) {
      this.power = power;
      this.width = width;
      this.op = op;
      this.implicit = implicit;
    }

    abstract Node apply(Node left) throws ToolException, Ambiguous, UnknownWord;
  }

  private Infix binary(Op op, int width) {
    return binary(op, width, false, false);
  }

  private Infix binary(Op op, int width, boolean reversed, boolean implicit) {
    return new Infix(op.power, width, op, implicit) {
      @Override
      Node apply(Node left) throws ToolException, Ambiguous, UnknownWord {
        Node right = expression(op == Op.POW ? POWER - 1 : op.power);
        Node a = reversed ? right : left;
        Node b = reversed ? left : right;
        return op == Op.ADD || op == Op.SUB ? additive(op, a, b) : new Bin(op, a, b);
      }
    };
  }

  private Infix postfix(int width, java.util.function.UnaryOperator<Node> make) {
    return new Infix(POSTFIX, width, null, false) {
      @Override
      Node apply(Node left) {
        return make.apply(left);
      }
    };
  }

  private Infix infix(Node left) throws ToolException, Ambiguous {
    Lexeme t = toks.get(pos);
    if (t.kind() == Kind.SYMBOL) {
      switch (t.text()) {
        case "+":
          return binary(Op.ADD, 1);
        case "-":
          return binary(Op.SUB, 1);
        case "*":
          return binary(Op.MUL, 1);
        case "/":
          return binary(Op.DIV, 1);
        case "//":
          return new Infix(MULTIPLICATIVE, 1, null, false) {
            @Override
            Node apply(Node left) throws ToolException, Ambiguous, UnknownWord {
              return Call.of(Fn.FLOOR, new Bin(Op.DIV, left, expression(MULTIPLICATIVE))); // Python's floor division
            }
          };
        case "^":
          return binary(Op.POW, 1);
        case "%":
          return percentSign();
        case "!":
          if (pos + 1 < end && toks.get(pos + 1).isSymbol("!") && toks.get(pos + 1).start() == t.end()) {
            throw syntax("'!!' (a double factorial) is not supported; write (n!)! for a factorial of a factorial", t);
          }
          return postfix(1, Node.Factorial::new);
        case "°":
          return postfix(1, Node.Degrees::new);
        case "(":
          return implicitProduct();
        case "√", "∛", "∜":
          return implicitProduct();
        default:
          return null;
      }
    }
    if (t.kind() == Kind.SUPERSCRIPT) {
      Node exponent = signedInteger(t.value());
      return postfix(1, x -> new Bin(Op.POW, x, exponent));
    }
    if (t.kind() == Kind.NUMBER) {
      if (isMixedNumber(left)) {
        return new Infix(POSTFIX, 3, null, false) {
          @Override
          Node apply(Node whole) {
            Lexeme n = toks.get(pos - 3);
            Lexeme d = toks.get(pos - 1);
            return new Bin(Op.ADD, whole, new Bin(Op.DIV, new Num(n.value()), new Num(d.value())));
          }
        };
      }
      throw twoNumbers(left, t);
    }
    if (t.kind() == Kind.FRACTION) {
      return implicitProduct();
    }
    if (t.kind() != Kind.WORD) {
      return null;
    }
    switch (t.text()) {
      case "plus":
        return binary(Op.ADD, 1);
      case "minus":
        return binary(Op.SUB, 1);
      case "times":
        return binary(Op.MUL, 1);
      case "x":
        return binary(Op.MUL, 1);
      case "mod", "modulo":
        return binary(Op.MOD, 1);
      case "of":
        return binary(Op.MUL, 1);
      case "choose":
        return binary(Op.CHOOSE, 1);
      case "over":
        return binary(Op.DIV, 1);
      case "squared":
        return postfix(1, x -> new Bin(Op.POW, x, Num.of(2)));
      case "cubed":
        return postfix(1, x -> new Bin(Op.POW, x, Num.of(3)));
      case "factorial":
        return postfix(1, Node.Factorial::new);
      case "percent", "pct":
        return percentWord(1);
      case "degrees", "degree", "deg":
        return postfix(1, Node.Degrees::new);
      case "radians", "radian", "rad":
        return postfix(1, x -> x);
      default:
        break;
    }
    if (wordsAt(pos, "per", "cent")) {
      return percentWord(2);
    }
    if (wordsAt(pos, "multiplied", "by")) {
      return binary(Op.MUL, 2);
    }
    if (wordsAt(pos, "divided", "by")) {
      return binary(Op.DIV, 2);
    }
    if (wordsAt(pos, "out", "of")) {
      return binary(Op.DIV, 2);
    }
    if (wordsAt(pos, "increased", "by")) {
      return binary(Op.ADD, 2);
    }
    if (wordsAt(pos, "decreased", "by") || wordsAt(pos, "reduced", "by")) {
      return binary(Op.SUB, 2);
    }
    if (wordsAt(pos, "added", "to")) {
      return binary(Op.ADD, 2, true, false);
    }
    if (wordsAt(pos, "subtracted", "from")) {
      return binary(Op.SUB, 2, true, false);
    }
    if (left instanceof Node.Percent && (wordsAt(pos, "more", "than") || wordsAt(pos, "less", "than")
        || wordsAt(pos, "fewer", "than") || t.text().equals("off"))) {
      boolean increase = t.text().equals("more");
      int width = t.text().equals("off") ? 1 : 2;
      return new Infix(MULTIPLICATIVE, width, null, false) {
        @Override
        Node apply(Node l) throws ToolException, Ambiguous, UnknownWord {
          Node base = expression(MULTIPLICATIVE);
          return new Node.PercentChange(base, ((Node.Percent) l).x(), increase);
        }
      };
    }
    for (String[] power : new String[][] {{"to", "power", "of"}, {"to", "power"}, {"raised", "to", "power", "of"},
        {"raised", "to", "power"}, {"raised", "to"}}) {
      if (wordsAt(pos, power)) {
        return powerWords(power.length);
      }
    }
    if (t.isWord("to") && pos + 1 < end && toks.get(pos + 1).kind() == Kind.ORDINAL) {
      return powerWords(1);
    }
    if (wordsAt(pos, "as", "a", "percentage", "of") || wordsAt(pos, "as", "a", "percent", "of")
        || wordsAt(pos, "is", "what", "percent", "of") || wordsAt(pos, "is", "what", "percentage", "of")) {
      return new Infix(MULTIPLICATIVE, 4, null, false) {
        @Override
        Node apply(Node l) throws ToolException, Ambiguous, UnknownWord {
          Node whole = expression(MULTIPLICATIVE);
          return new Bin(Op.MUL, new Bin(Op.DIV, l, whole), Num.of(100));
        }
      };
    }
    for (String[] suffix : new String[][] {{"as", "a", "percentage"}, {"as", "a", "percent"}, {"to", "a", "percentage"},
        {"to", "a", "percent"}, {"in", "percent"}, {"as", "percent"}, {"to", "percent"}, {"as", "percentage"}}) {
      if (wordsAt(pos, suffix) && pos + suffix.length == end) {
        return new Infix(WHOLE, suffix.length, null, false) {
          @Override
          Node apply(Node l) {
            return new Bin(Op.MUL, l, Num.of(100));
          }
        };
      }
    }
    for (String[] suffix : new String[][] {{"as", "a", "decimal"}, {"to", "a", "decimal"}, {"in", "decimal"}, {"as", "decimal"},
        {"as", "a", "decimal", "number"}, {"as", "a", "number"}}) {
      if (wordsAt(pos, suffix) && pos + suffix.length == end) {
        return new Infix(WHOLE, suffix.length, null, false) {
          @Override
          Node apply(Node l) {
            return l;
          }
        };
      }
    }
    if (startsOperand(t)) {
      return implicitProduct();
    }
    return null;
  }

  /** {@code 1 1/2}: a whole number, a space, and a proper fraction of whole numbers written with '/'. */
  private boolean isMixedNumber(Node left) {
    if (!(left instanceof Num) || pos + 2 >= end || !isDigits(toks.get(pos - 1)) || !isDigits(toks.get(pos))
        || !toks.get(pos + 1).isSymbol("/") || !isDigits(toks.get(pos + 2)) || !adjacent(pos, pos + 1) || !adjacent(pos + 1, pos + 2)) {
      return false;
    }
    BigDecimal n = toks.get(pos).value();
    BigDecimal d = toks.get(pos + 2).value();
    boolean followedByOperand = pos + 3 < end && (toks.get(pos + 3).isSymbol("/") || toks.get(pos + 3).isSymbol("^"));
    return d.compareTo(BigDecimal.ONE) > 0 && n.signum() > 0 && n.compareTo(d) < 0 && !followedByOperand;
  }

  private static boolean isDigits(Lexeme l) {
    return l.kind() == Kind.NUMBER && l.text().chars().allMatch(ch -> ch >= '0' && ch <= '9');
  }

  private Infix implicitProduct() {
    return new Infix(MULTIPLICATIVE, 0, Op.MUL, true) {
      @Override
      Node apply(Node left) throws ToolException, Ambiguous, UnknownWord {
        return new Bin(Op.MUL, left, expression(MULTIPLICATIVE));
      }
    };
  }

  /** "to the power of", "raised to", "to the 10th (power)": the exponent follows. */
  private Infix powerWords(int width) {
    return new Infix(POWER, width, Op.POW, false) {
      @Override
      Node apply(Node left) throws ToolException, Ambiguous, UnknownWord {
        if (pos < end && toks.get(pos).kind() == Kind.ORDINAL) {
          Node exponent = new Num(toks.get(pos).value());
          pos++;
          if (pos < end && toks.get(pos).isWord("power")) {
            pos++;
          }
          return new Bin(Op.POW, left, exponent);
        }
        return new Bin(Op.POW, left, expression(POWER - 1));
      }
    };
  }

  /** '%' after an operand: a percentage, unless another operand follows (then modulo or percent?). */
  private Infix percentSign() throws Ambiguous {
    int next = pos + 1;
    if (next < end && (toks.get(next).kind() == Kind.NUMBER || startsOperand(toks.get(next)))) {
      Choice c = readings.of(Ambiguity.PERCENT_BETWEEN_NUMBERS);
      if (c == Choice.REFUSE) {
        throw new Ambiguous(Ambiguity.PERCENT_BETWEEN_NUMBERS,
            "'%' between two numbers reads as a remainder in programming languages and as a percentage in arithmetic");
      }
      if (c == Choice.FIRST) {
        return binary(Op.MOD, 1);
      }
      return new Infix(MULTIPLICATIVE, 1, Op.MUL, false) {
        @Override
        Node apply(Node left) throws ToolException, Ambiguous, UnknownWord {
          return new Bin(Op.MUL, new Node.Percent(left), expression(MULTIPLICATIVE));
        }
      };
    }
    return postfix(1, Node.Percent::new);
  }

  private Infix percentWord(int width) {
    return postfix(width, Node.Percent::new);
  }

  /** {@code a + b%} is a percentage change of a (a * (1 + b/100)), unless a is itself a percentage. */
  private static Node additive(Op op, Node left, Node right) {
    if (right instanceof Node.Percent p && !isPercentage(left)) {
      return new Node.PercentChange(left, p.x(), op == Op.ADD);
    }
    return new Bin(op, left, right);
  }

  private static boolean isPercentage(Node n) {
    if (n instanceof Node.Percent) {
      return true;
    }
    if (n instanceof Node.Neg g) {
      return isPercentage(g.x());
    }
    return n instanceof Bin b && (b.op() == Op.ADD || b.op() == Op.SUB) && isPercentage(b.left()) && isPercentage(b.right());
  }

  private boolean startsOperand(Lexeme t) {
    if (t.kind() == Kind.FRACTION) {
      return true;
    }
    if (t.kind() == Kind.SYMBOL) {
      return t.text().equals("(") || t.text().equals("√") || t.text().equals("∛") || t.text().equals("∜");
    }
    if (t.kind() != Kind.WORD) {
      return false;
    }
    String w = t.text();
    return w.equals("pi") || w.equals("π") || w.equals("e") || (FUNCTION_NAMES.containsKey(w) && !w.equals("root"));
  }

  private boolean wordsAt(int at, String... words) {
    if (at + words.length > end) {
      return false;
    }
    for (int i = 0; i < words.length; i++) {
      if (!toks.get(at + i).isWord(words[i])) {
        return false;
      }
    }
    return true;
  }

  // =====================================================================================
  // Operands
  // =====================================================================================

  private Node prefix() throws ToolException, Ambiguous, UnknownWord {
    if (pos >= end) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, pos == 0 ? "the expression is empty"
          : "the expression ends where a number was expected" + after(pos - 1));
    }
    Lexeme t = toks.get(pos);
    switch (t.kind()) {
      case NUMBER:
        return number();
      case FRACTION:
        pos++;
        return fraction(t);
      case ORDINAL:
        if (pos + 1 < end && toks.get(pos + 1).isWord("root")) {
          pos += 2;
          return Call.of(Fn.ROOT, wordOperand(t), new Num(t.value()));
        }
        throw syntax("an ordinal '" + t.text() + "' where a number was expected", t);
      case SUPERSCRIPT:
      case SUBSCRIPT:
        throw syntax("a raised or lowered number without a base", t);
      case SYMBOL:
        return symbolPrefix(t);
      case WORD:
        return wordPrefix(t);
      default:
        throw unexpected(t);
    }
  }

  private Node symbolPrefix(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    switch (t.text()) {
      case "(":
        return group();
      case "|": {
        pos++;
        Node inner = expression(0);
        expectSymbol("|", "a closing '|' of the absolute value", t);
        return Call.of(Fn.ABS, inner);
      }
      case "-":
        pos++;
        return new Node.Neg(expression(PREFIX));
      case "+":
        pos++;
        return expression(PREFIX);
      case "√":
        pos++;
        return Call.of(Fn.SQRT, expression(PREFIX));
      case "∛":
        pos++;
        return Call.of(Fn.CBRT, expression(PREFIX));
      case "∜":
        pos++;
        return Call.of(Fn.ROOT, expression(PREFIX), Num.of(4));
      default:
        throw unexpected(t);
    }
  }

  private Node group() throws ToolException, Ambiguous, UnknownWord {
    Lexeme open = toks.get(pos);
    if (++parenDepth > MAX_DEPTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "parentheses nest deeper than " + MAX_DEPTH + " levels");
    }
    pos++;
    boolean call = inCallArguments;
    boolean list = inWordList;
    inCallArguments = false;
    inWordList = false;
    Node inner = expression(0);
    inCallArguments = call;
    inWordList = list;
    expectSymbol(")", "a closing ')'", open);
    parenDepth--;
    lastGroupEnd = pos;
    return inner;
  }

  private void expectSymbol(String symbol, String what, Lexeme opener) throws ToolException {
    if (pos < end && toks.get(pos).isSymbol(symbol)) {
      pos++;
      return;
    }
    if (pos >= end) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "missing " + what + " for the one at position " + position(opener));
    }
    throw syntax("expected " + what + " but found '" + toks.get(pos).text() + "'", toks.get(pos));
  }

  /** A literal, with digit grouping (1,000,000), scale words (2.5 million) and fractions (2½, 3 quarters). */
  private Node number() throws ToolException, Ambiguous, UnknownWord {
    Lexeme first = toks.get(pos);
    pos++;
    BigDecimal value = first.value();
    String written = first.text();
    if (isGroupHead(first)) {
      StringBuilder digits = new StringBuilder(written.replace("_", ""));
      while (pos + 1 < end && toks.get(pos).isSymbol(",") && adjacent(pos - 1, pos) && adjacent(pos, pos + 1)
          && isGroup(toks.get(pos + 1))) {
        digits.append(toks.get(pos + 1).text());
        written = digits.toString();
        pos += 2;
      }
      value = new BigDecimal(digits.toString());
    }
    if (!inCallArguments && !inWordList && pos + 1 < end && toks.get(pos).isSymbol(",") && adjacent(pos - 1, pos)
        && adjacent(pos, pos + 1) && toks.get(pos + 1).kind() == Kind.NUMBER) {
      String fractionDigits = toks.get(pos + 1).text();
      throw new ToolException(new reckoner.tool.ToolError(ErrorCode.SYNTAX_ERROR, "'" + written + "," + fractionDigits
          + "' at position " + position(first) + " has a decimal comma or misplaced digit grouping; write the decimal point"
          + " as '.' and group thousands in threes", List.of(written + "." + fractionDigits)));
    }
    Node node = new Num(value);
    // Scale words: 2.5 million, 3 thousand.
    while (pos < end && toks.get(pos).kind() == Kind.WORD && (SCALES.containsKey(toks.get(pos).text())
        || toks.get(pos).text().equals("hundred") || toks.get(pos).text().equals("dozen"))) {
      String scale = toks.get(pos).text();
      value = scale.equals("dozen") ? value.multiply(BigDecimal.valueOf(12))
          : value.scaleByPowerOfTen(scale.equals("hundred") ? 2 : SCALES.get(scale));
      node = new Num(value);
      pos++;
    }
    if (pos < end && toks.get(pos).kind() == Kind.FRACTION && toks.get(pos).start() == toks.get(pos - 1).end()) {
      Lexeme f = toks.get(pos);
      pos++;
      return new Bin(Op.ADD, node, fraction(f)); // a mixed number: 2½ is 2 + 1/2
    }
    return fractionWords(node);
  }

  private boolean isGroupHead(Lexeme l) {
    String w = l.text();
    return !inCallArguments && w.chars().allMatch(ch -> ch >= '0' && ch <= '9') && w.length() >= 1 && w.length() <= 3;
  }

  private static boolean isGroup(Lexeme l) {
    return l.kind() == Kind.NUMBER && l.text().matches("[0-9]{3}(\\.[0-9]+)?");
  }

  private boolean adjacent(int a, int b) {
    return toks.get(a).end() == toks.get(b).start();
  }

  private static Node fraction(Lexeme f) {
    return new Bin(Op.DIV, new Num(f.value()), Num.of(f.denominator()));
  }

  /** "two thirds", "3 quarters", "a half": a count followed by a fraction word. */
  private Node fractionWords(Node count) {
    if (pos < end && toks.get(pos).kind() == Kind.WORD && FRACTION_WORDS.containsKey(toks.get(pos).text())
        && !(pos + 1 < end && toks.get(pos + 1).isWord("root"))) {
      int d = FRACTION_WORDS.get(toks.get(pos).text());
      pos++;
      return new Bin(Op.DIV, count, Num.of(d));
    }
    return count;
  }

  /** A signed whole exponent as a tree: 2 or -(3). */
  private static Node signedInteger(BigDecimal v) {
    return v.signum() < 0 ? new Node.Neg(new Num(v.negate())) : new Num(v);
  }

  private Node wordPrefix(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    String w = t.text();
    switch (w) {
      case "pi", "π":
        pos++;
        return new Node.Const("pi");
      case "e":
        pos++;
        return new Node.Const("e");
      case "minus", "negative":
        pos++;
        return new Node.Neg(expression(PREFIX));
      case "plus", "positive":
        pos++;
        return expression(PREFIX);
      case "twice", "double":
        pos++;
        return new Bin(Op.MUL, Num.of(2), wordOperand(t));
      case "triple", "thrice":
        pos++;
        return new Bin(Op.MUL, Num.of(3), wordOperand(t));
      case "half":
        pos++;
        return new Bin(Op.DIV, Num.of(1), Num.of(2));
      case "a", "an":
        return article(t);
      case "add":
        pos++;
        return verb(Op.ADD, Set.of("to", "and"), t);
      case "subtract":
        pos++;
        return verb(Op.SUB, Set.of("from"), t);
      case "multiply":
        pos++;
        return verb(Op.MUL, Set.of("by", "and"), t);
      case "divide":
        pos++;
        return verb(Op.DIV, Set.of("by"), t);
      case "increase":
        pos++;
        return verb(Op.ADD, Set.of("by"), t);
      case "decrease", "reduce", "lower":
        pos++;
        return verb(Op.SUB, Set.of("by"), t);
      case "what":
        return whatPercent(t);
      case "percent", "percentage":
        return percentChange(t);
      case "remainder":
        return remainder(t);
      case "difference":
        return difference(t);
      case "quotient":
        return quotient(t);
      case "reciprocal":
        pos++;
        return new Bin(Op.DIV, Num.of(1), wordOperand(t));
      case "factorial", "fact":
        pos++;
        return new Node.Factorial(functionOperand(t, false));
      case "pow", "power":
        return powCall(t);
      case "comb":
        return combCall(t);
      case "math":
        if (pos + 2 < end && toks.get(pos + 1).isSymbol(".") && adjacent(pos, pos + 1) && toks.get(pos + 2).kind() == Kind.WORD) {
          return libraryName(toks.get(pos + 2));
        }
        break;
      case "mod":
        return modCall(t);
      case "log", "logarithm":
        return logarithm(t);
      case "natural":
        if (wordsAt(pos + 1, "log") || wordsAt(pos + 1, "logarithm")) {
          pos += 2;
          return Call.of(Fn.LN, functionOperand(t, true));
        }
        break;
      case "square", "cube":
        return squareOrCube(t);
      case "absolute":
        if (wordsAt(pos + 1, "value")) {
          pos += 2;
          return Call.of(Fn.ABS, functionOperand(t, true));
        }
        break;
      default:
        break;
    }
    if (SMALL_NUMBERS.containsKey(w) || w.contains("-") && SMALL_NUMBERS.containsKey(w.substring(0, w.indexOf('-')))) {
      return numberWords();
    }
    if (ORDINAL_WORDS.containsKey(w) && wordsAt(pos + 1, "root")) {
      pos += 2;
      return Call.of(Fn.ROOT, wordOperand(t), Num.of(ORDINAL_WORDS.get(w)));
    }
    if (LIST_WORDS.contains(w)) {
      return listWord(t);
    }
    Fn fn = FUNCTION_NAMES.get(w);
    if (fn != null) {
      pos++;
      return function(fn, t, false);
    }
    fn = FUNCTION_WORDS.get(w);
    if (fn != null) {
      pos++;
      return function(fn, t, true);
    }
    if (w.length() == 1 || w.equals("x") || w.equals("y")) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "'" + w + "' at position " + position(t)
          + " is a variable, and arith has none; write the number itself");
    }
    throw new UnknownWord("unknown word '" + w + "' at position " + position(t), t.start(), t.end());
  }

  /** "a" or "an" before a count word: a hundred, a million, a half, a third of. */
  private Node article(Lexeme t) throws ToolException, UnknownWord {
    if (pos + 1 < end && toks.get(pos + 1).kind() == Kind.WORD) {
      String next = toks.get(pos + 1).text();
      if (next.equals("hundred") || next.equals("dozen") || SCALES.containsKey(next)) {
        pos++;
        return numberWords();
      }
      if (FRACTION_WORDS.containsKey(next)) {
        pos++;
        return fractionWords(Num.of(1));
      }
    }
    throw new UnknownWord("unknown word '" + t.text() + "' at position " + position(t), t.start(), t.end());
  }

  /** Cardinal number words: "two hundred five thousand", "twenty-five", "three point one four". */
  private Node numberWords() throws ToolException {
    BigDecimal total = BigDecimal.ZERO;
    BigDecimal current = BigDecimal.ZERO;
    boolean any = false;
    if (toks.get(pos).isWord("a") || toks.get(pos).isWord("an")) {
      current = BigDecimal.ONE;
      pos++;
    }
    while (pos < end && toks.get(pos).kind() == Kind.WORD) {
      String w = toks.get(pos).text();
      Integer small = smallNumber(w);
      if (small != null) {
        current = current.add(BigDecimal.valueOf(small));
      } else if (w.equals("hundred")) {
        current = (current.signum() == 0 ? BigDecimal.ONE : current).scaleByPowerOfTen(2);
      } else if (w.equals("dozen")) {
        current = (current.signum() == 0 ? BigDecimal.ONE : current).multiply(BigDecimal.valueOf(12));
      } else if (SCALES.containsKey(w)) {
        total = total.add((current.signum() == 0 ? BigDecimal.ONE : current).scaleByPowerOfTen(SCALES.get(w)));
        current = BigDecimal.ZERO;
      } else if (w.equals("point") && any && pos + 1 < end && smallNumber(toks.get(pos + 1).text()) != null
          && smallNumber(toks.get(pos + 1).text()) < 10) {
        pos++;
        StringBuilder fraction = new StringBuilder();
        while (pos < end && toks.get(pos).kind() == Kind.WORD && smallNumber(toks.get(pos).text()) != null
            && smallNumber(toks.get(pos).text()) < 10) {
          fraction.append(smallNumber(toks.get(pos).text()));
          pos++;
        }
        current = current.add(new BigDecimal("0." + fraction));
        any = true;
        break;
      } else {
        break;
      }
      any = true;
      pos++;
    }
    return fractionWords(new Num(total.add(current)));
  }

  private static Integer smallNumber(String w) {
    Integer v = SMALL_NUMBERS.get(w);
    if (v != null) {
      return v;
    }
    int hyphen = w.indexOf('-');
    if (hyphen > 0) {
      Integer tens = SMALL_NUMBERS.get(w.substring(0, hyphen));
      Integer units = SMALL_NUMBERS.get(w.substring(hyphen + 1));
      if (tens != null && units != null) {
        return tens + units;
      }
    }
    return null;
  }

  /** "add A to B", "subtract A from B", "multiply A by B", "divide A by B", "increase A by B". */
  private Node verb(Op op, Set<String> joiners, Lexeme verb) throws ToolException, Ambiguous, UnknownWord {
    Node a = expression(0);
    if (pos >= end || toks.get(pos).kind() != Kind.WORD || !joiners.contains(toks.get(pos).text())) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "'" + verb.text() + "' at position " + position(verb)
          + " needs '" + String.join("' or '", new java.util.TreeSet<>(joiners)) + "' before its second number");
    }
    String joiner = toks.get(pos).text();
    pos++;
    Node b = lastListItem();
    if (op == Op.SUB && joiner.equals("from")) {
      return additive(Op.SUB, b, a); // subtract A from B: B - A
    }
    if (op == Op.ADD && joiner.equals("to")) {
      return additive(Op.ADD, b, a); // add A to B: B + A
    }
    return op == Op.ADD || op == Op.SUB ? additive(op, a, b) : new Bin(op, a, b);
  }

  /** "what percent of B is A", "what percent is A of B": A / B * 100. */
  private Node whatPercent(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    if (!(wordsAt(pos + 1, "percent") || wordsAt(pos + 1, "percentage"))) {
      throw new UnknownWord("unknown word 'what' at position " + position(t), t.start(), t.end());
    }
    pos += 2;
    Node part;
    Node whole;
    if (wordsAt(pos, "of")) {
      pos++;
      whole = expression(0);
      expectWord("is", t);
      part = lastListItem();
    } else if (wordsAt(pos, "is")) {
      pos++;
      part = expression(MULTIPLICATIVE);
      expectWord("of", t);
      whole = lastListItem();
    } else {
      throw syntax("'what percent' needs 'of' or 'is' after it", t);
    }
    return new Bin(Op.MUL, new Bin(Op.DIV, part, whole), Num.of(100));
  }

  /** "percent change from A to B" = (B - A) / A * 100; "percent decrease" = (A - B) / A * 100. */
  private Node percentChange(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    int kind = pos + 1 < end && toks.get(pos + 1).kind() == Kind.WORD ? switch (toks.get(pos + 1).text()) {
      case "change", "increase", "difference" -> 1;
      case "decrease" -> -1;
      default -> 0;
    } : 0;
    if (kind == 0 || !wordsAt(pos + 2, "from")) {
      throw new UnknownWord("'" + t.text() + "' at position " + position(t) + " must follow a number (15%, 15 percent)"
          + " or start 'percent change from A to B'", t.start(), t.end());
    }
    pos += 3;
    Node from = expression(0);
    expectWord("to", t);
    Node to = lastListItem();
    Node change = kind > 0 ? new Bin(Op.SUB, to, from) : new Bin(Op.SUB, from, to);
    return new Bin(Op.MUL, new Bin(Op.DIV, change, from), Num.of(100));
  }

  /** "remainder of A divided by B", "remainder when A is divided by B": A mod B. */
  private Node remainder(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    if (!(wordsAt(pos, "of") || wordsAt(pos, "when"))) {
      throw syntax("'remainder' needs 'of' or 'when' after it (the remainder of 17 divided by 5)", t);
    }
    pos++;
    Node a = expression(MULTIPLICATIVE);
    if (wordsAt(pos, "is")) {
      pos++;
    }
    if (wordsAt(pos, "divided", "by")) {
      pos += 2;
    } else if (pos < end && (toks.get(pos).isSymbol("/") || toks.get(pos).isWord("by") || toks.get(pos).isWord("mod")
        || toks.get(pos).isWord("modulo"))) {
      pos++;
    } else {
      throw syntax("'remainder' needs 'divided by' between its numbers", t);
    }
    return new Bin(Op.MOD, a, expression(MULTIPLICATIVE));
  }

  /** "difference between A and B": A - B when A >= B are plain numbers; otherwise the order is asked. */
  private Node difference(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    if (!(wordsAt(pos, "between") || wordsAt(pos, "of"))) {
      throw syntax("'difference' needs 'between' or 'of' after it (the difference between 45 and 28)", t);
    }
    pos++;
    boolean list = inWordList;
    inWordList = true;
    Node a = expression(0);
    expectWord("and", t);
    Node b = lastListItem();
    inWordList = list;
    if (a instanceof Num x && b instanceof Num y && x.value().compareTo(y.value()) >= 0) {
      return new Bin(Op.SUB, a, b);
    }
    Choice c = readings.of(Ambiguity.DIFFERENCE_ORDER);
    if (c == Choice.REFUSE) {
      throw new Ambiguous(Ambiguity.DIFFERENCE_ORDER, "'difference between' does not say which number is subtracted");
    }
    return c == Choice.FIRST ? new Bin(Op.SUB, a, b) : new Bin(Op.SUB, b, a);
  }

  /** "quotient of A and B": A / B. */
  private Node quotient(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    expectWord("of", t);
    Node a = expression(MULTIPLICATIVE);
    if (wordsAt(pos, "and") || wordsAt(pos, "by")) {
      pos++;
    } else if (wordsAt(pos, "divided", "by")) {
      pos += 2;
    } else {
      throw syntax("'quotient of' needs 'and' between its numbers", t);
    }
    return new Bin(Op.DIV, a, lastListItem());
  }

  /** "sum of A, B and C", "average of ...", "product of ...": the list, combined. */
  private Node listWord(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    String w = t.text();
    pos++;
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(t);
      return combine(w, args, t);
    }
    if (wordsAt(pos, "of")) {
      pos++;
    } else if (!w.equals("sum") && !w.equals("average") && !w.equals("mean") && !w.equals("total")) {
      throw syntax("'" + w + "' needs 'of' after it (the " + w + " of 3, 4 and 5)", t);
    }
    boolean list = inWordList;
    inWordList = true;
    List<Node> items = new ArrayList<>();
    while (true) {
      int itemStart = pos;
      Node item = expression(PREFIX);
      if (pos < end && isListSeparator()) {
        items.add(item);
        skipListSeparator();
        continue;
      }
      int saved = pos;
      Node wide = continueFrom(item, 0);
      if (pos < end && isListSeparator()) {
        items.add(wide);
        skipListSeparator();
        continue;
      }
      if (pos != saved) {
        Choice c = readings.of(Ambiguity.LIST_EXTENT);
        if (c == Choice.REFUSE) {
          throw new Ambiguous(Ambiguity.LIST_EXTENT, "the " + w + " of a list followed by '"
              + toks.get(saved).text() + "' does not say where the list ends");
        }
        if (c == Choice.FIRST) {
          pos = saved;
          items.add(item);
        } else {
          items.add(wide);
        }
      } else {
        items.add(item);
      }
      if (itemStart == pos) {
        throw unexpected(toks.get(pos));
      }
      break;
    }
    inWordList = list;
    return combine(w, items, t);
  }

  private boolean isListSeparator() {
    Lexeme l = toks.get(pos);
    return l.isSymbol(",") || l.isWord("and");
  }

  private void skipListSeparator() {
    if (toks.get(pos).isSymbol(",") && pos + 1 < end && toks.get(pos + 1).isWord("and")) {
      pos++;
    }
    pos++;
  }

  private Node combine(String w, List<Node> items, Lexeme t) throws ToolException {
    if (items.size() < 2) {
      throw syntax("the " + w + " of a single number; separate the numbers with ', ' or 'and' (the " + w
          + " of 3, 4 and 5)", t);
    }
    Op op = w.equals("product") ? Op.MUL : Op.ADD;
    Node acc = items.get(0);
    for (int i = 1; i < items.size(); i++) {
      acc = new Bin(op, acc, items.get(i));
    }
    if (w.equals("average") || w.equals("mean") || w.equals("avg")) {
      return new Bin(Op.DIV, acc, Num.of(items.size()));
    }
    return acc;
  }

  /**
   * The second operand of a verb or the last of a list: when operators follow it, whether they
   * belong to it or to the whole phrase is unclear (LIST_EXTENT).
   */
  private Node lastListItem() throws ToolException, Ambiguous, UnknownWord {
    Node item = expression(PREFIX);
    int saved = pos;
    Node wide = continueFrom(item, 0);
    if (pos == saved) {
      return item;
    }
    Choice c = readings.of(Ambiguity.LIST_EXTENT);
    if (c == Choice.REFUSE) {
      throw new Ambiguous(Ambiguity.LIST_EXTENT, "the words before the last number do not say whether '"
          + toks.get(saved).text() + "' applies to that number alone or to the whole");
    }
    if (c == Choice.FIRST) {
      pos = saved;
      return item;
    }
    return wide;
  }

  private void expectWord(String w, Lexeme phrase) throws ToolException {
    if (pos < end && toks.get(pos).isWord(w)) {
      pos++;
      return;
    }
    throw new ToolException(ErrorCode.SYNTAX_ERROR, "the phrase starting '" + phrase.text() + "' at position "
        + position(phrase) + " needs '" + w + "'" + (pos < end ? " where it has '" + toks.get(pos).text() + "'" : " before its end"));
  }

  /** "square root of x", "square of x", "cube root of x", "cube of x". */
  private Node squareOrCube(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    boolean square = t.text().equals("square");
    if (wordsAt(pos + 1, "root")) {
      pos += 2;
      Node x = functionOperand(t, true);
      return square ? Call.of(Fn.SQRT, x) : Call.of(Fn.CBRT, x);
    }
    if (wordsAt(pos + 1, "of")) {
      pos++;
      Node x = functionOperand(t, true);
      return new Bin(Op.POW, x, Num.of(square ? 2 : 3));
    }
    throw new UnknownWord("unknown use of '" + t.text() + "' at position " + position(t)
        + "; write 'square root of x', 'square of x' or 'x squared'", t.start(), t.end());
  }

  /** log x (base 10), log_b(x), log₂(x), log base b of x; log(x, b) is ambiguous. */
  private Node logarithm(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    Node base = null;
    if (pos < end && toks.get(pos).kind() == Kind.SUBSCRIPT) {
      base = new Num(toks.get(pos).value());
      pos++;
    } else if (pos < end && toks.get(pos).isSymbol("_")) {
      pos++;
      if (pos < end && toks.get(pos).kind() == Kind.NUMBER) {
        base = new Num(toks.get(pos).value());
        pos++;
      } else if (pos < end && toks.get(pos).isSymbol("(")) {
        base = group();
      } else {
        throw syntax("'log_' needs a base: log_2(8)", t);
      }
    } else if (wordsAt(pos, "base")) {
      pos++;
      base = expression(POWER); // a number or a group: log base 2 of 8
    }
    if (base != null) {
      return Call.of(Fn.LOG_BASE, functionOperand(t, !t.text().equals("log") || wordsAt(pos, "of")), base);
    }
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(t);
      if (args.size() == 1) {
        return Call.of(Fn.LOG10, args.get(0));
      }
      if (args.size() == 2) {
        Choice c = readings.of(Ambiguity.LOG_ARGUMENT_ORDER);
        if (c == Choice.REFUSE) {
          throw new Ambiguous(Ambiguity.LOG_ARGUMENT_ORDER, "log with two arguments puts the base second in some"
              + " languages and first in others");
        }
        return c == Choice.FIRST ? Call.of(Fn.LOG_BASE, args.get(0), args.get(1)) : Call.of(Fn.LOG_BASE, args.get(1), args.get(0));
      }
      throw syntax("log takes one argument (base 10) or a base written log_b(x)", t);
    }
    return Call.of(Fn.LOG10, functionOperand(t, t.text().equals("logarithm") || wordsAt(pos, "of")));
  }

  /** pow(a, b) and power(a, b): a ^ b, as in C, Python and spreadsheets. */
  private Node powCall(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(t);
      if (args.size() == 2) {
        return new Bin(Op.POW, args.get(0), args.get(1));
      }
      throw syntax("pow takes two arguments: pow(2, 10)", t);
    }
    throw new UnknownWord("unknown use of '" + t.text() + "' at position " + position(t)
        + "; write 2 ^ 10, 2 ** 10 or 2 to the power of 10", t.start(), t.end());
  }

  /** comb(n, k): n choose k, as Python's math.comb. */
  private Node combCall(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(t);
      if (args.size() == 2) {
        return new Bin(Op.CHOOSE, args.get(0), args.get(1));
      }
    }
    throw syntax("comb takes two arguments: comb(10, 3)", t);
  }

  /**
   * A name after {@code math.} (Python's math module, JavaScript's Math object): those libraries'
   * meanings, so math.log is the natural logarithm and math.log(x, b) has the base second.
   */
  private Node libraryName(Lexeme name) throws ToolException, Ambiguous, UnknownWord {
    pos += 2;
    switch (name.text()) {
      case "pi":
        pos++;
        return new Node.Const("pi");
      case "e":
        pos++;
        return new Node.Const("e");
      case "log": {
        pos++;
        if (pos < end && toks.get(pos).isSymbol("(")) {
          List<Node> args = arguments(name);
          if (args.size() == 1) {
            return Call.of(Fn.LN, args.get(0));
          }
          if (args.size() == 2) {
            return Call.of(Fn.LOG_BASE, args.get(0), args.get(1));
          }
        }
        throw syntax("math.log takes one argument (natural) or two (x, base)", name);
      }
      case "radians": {
        pos++;
        List<Node> args = arguments(name);
        if (args.size() == 1) {
          return new Node.Degrees(args.get(0));
        }
        throw syntax("math.radians takes one argument", name);
      }
      case "degrees": {
        pos++;
        List<Node> args = arguments(name);
        if (args.size() == 1) {
          return new Bin(Op.DIV, new Bin(Op.MUL, args.get(0), Num.of(180)), new Node.Const("pi"));
        }
        throw syntax("math.degrees takes one argument", name);
      }
      case "factorial", "pow", "comb", "sqrt", "cbrt", "exp", "sin", "cos", "tan", "asin", "acos", "atan", "floor",
          "ceil", "trunc", "log10", "log2", "gcd", "lcm", "fabs", "abs", "fmod", "max", "min":
        return wordPrefix(name);
      default:
        throw new UnknownWord("unknown name 'math." + name.text() + "' at position " + position(name), name.start(), name.end());
    }
  }

  /** mod(a, b): a mod b, floored as the infix mod. */
  private Node modCall(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(t);
      if (args.size() == 2) {
        return new Bin(Op.MOD, args.get(0), args.get(1));
      }
    }
    throw syntax("'mod' goes between two numbers (17 mod 5) or takes two arguments: mod(17, 5)", t);
  }

  /** A named function: f(args), f of x (English), or f x (formula style, binding like unary minus). */
  private Node function(Fn fn, Lexeme name, boolean englishWord) throws ToolException, Ambiguous, UnknownWord {
    if (pos < end && toks.get(pos).kind() == Kind.SUPERSCRIPT && toks.get(pos).text().equals("-1") && fn.isTrigonometric()) {
      pos++;
      fn = fn == Fn.SIN ? Fn.ASIN : fn == Fn.COS ? Fn.ACOS : Fn.ATAN;
    }
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(name);
      if (args.size() < fn.minArgs || args.size() > fn.maxArgs) {
        throw syntax(fn.wireName + " takes " + (fn.minArgs == fn.maxArgs ? String.valueOf(fn.minArgs)
            : fn.minArgs + " to " + fn.maxArgs) + " argument" + (fn.maxArgs == 1 ? "" : "s") + " but has " + args.size(), name);
      }
      return new Call(fn, args);
    }
    if (fn.minArgs > 1 || fn == Fn.MAX || fn == Fn.MIN || fn == Fn.GCD || fn == Fn.LCM) {
      throw syntax(fn.wireName + " needs its arguments in parentheses: " + fn.wireName + "(…)", name);
    }
    return Call.of(fn, functionOperand(name, englishWord || wordsAt(pos, "of")));
  }

  /**
   * The operand of a function written without parentheses. After an English phrase ("square root
   * of"), an operator after the operand makes its extent unclear (WORD_OPERAND_EXTENT); formula
   * style (sqrt 16 + 9) binds like unary minus.
   */
  private Node functionOperand(Lexeme name, boolean english) throws ToolException, Ambiguous, UnknownWord {
    if (pos < end && toks.get(pos).isWord("of")) {
      pos++;
      english = true;
    }
    return english ? wordOperand(name) : expression(PREFIX);
  }

  /** The operand of an English word operator (square root of, twice, half of); see above. */
  private Node wordOperand(Lexeme first) throws ToolException, Ambiguous, UnknownWord {
    if (pos < end && toks.get(pos).isWord("of")) {
      pos++;
    }
    String phrase = text.substring(first.start(), toks.get(pos - 1).end());
    if (pos >= end) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "the expression ends where a number was expected" + after(pos - 1));
    }
    boolean grouped = toks.get(pos).isSymbol("(");
    Node x = expression(PREFIX);
    if (grouped && lastGroupEnd == pos) {
      return x;
    }
    int saved = pos;
    if (pos < end) {
      Infix next = infix(x);
      if (next != null && next.power < POSTFIX) {
        Choice c = readings.of(Ambiguity.WORD_OPERAND_EXTENT);
        if (c == Choice.REFUSE) {
          throw new Ambiguous(Ambiguity.WORD_OPERAND_EXTENT, "the words do not say whether '" + toks.get(saved).text()
              + "' comes before or after '" + phrase + "' is applied");
        }
        if (c == Choice.SECOND) {
          return continueFrom(x, 0);
        }
      }
    }
    return x;
  }

  /** '(' arguments ')': comma-separated expressions; digits are never grouped inside. */
  private List<Node> arguments(Lexeme name) throws ToolException, Ambiguous, UnknownWord {
    Lexeme open = toks.get(pos);
    if (++parenDepth > MAX_DEPTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "parentheses nest deeper than " + MAX_DEPTH + " levels");
    }
    pos++;
    // sum([1, 2, 3]), max([3, 7]): a list written as one bracketed argument, as in Python.
    boolean bracketed = false;
    if (LIST_FUNCTIONS.contains(name.text()) && pos < end && toks.get(pos).isSymbol("(")) {
      int close = matchingParen(pos, end);
      if (close > 0 && close + 1 < end && toks.get(close + 1).isSymbol(")")) {
        bracketed = true;
        pos++;
      }
    }
    boolean call = inCallArguments;
    boolean list = inWordList;
    inCallArguments = true;
    inWordList = false;
    List<Node> args = new ArrayList<>();
    if (pos < end && toks.get(pos).isSymbol(")")) {
      throw syntax(name.text() + "() has no argument", name);
    }
    while (true) {
      args.add(expression(0));
      if (pos < end && toks.get(pos).isSymbol(",")) {
        pos++;
        continue;
      }
      break;
    }
    inCallArguments = call;
    inWordList = list;
    if (bracketed) {
      expectSymbol(")", "a closing ']'", open);
    }
    expectSymbol(")", "a closing ')'", open);
    parenDepth--;
    lastGroupEnd = pos;
    if (args.size() > 100) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, name.text() + " has more than 100 arguments");
    }
    return args;
  }

  // =====================================================================================
  // Errors
  // =====================================================================================

  private void enter() throws ToolException {
    if (++depth > 200) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the expression nests deeper than 200 levels");
    }
  }

  private ToolException twoNumbers(Node left, Lexeme t) {
    Lexeme before = toks.get(pos - 1);
    List<String> suggestions = new ArrayList<>();
    if (before.kind() == Kind.NUMBER && before.text().matches("[0-9]{1,3}") && t.text().matches("[0-9]{3}")) {
      suggestions.add(before.text() + t.text());
    }
    if (before.kind() == Kind.NUMBER && pos + 2 < end && toks.get(pos + 1).isSymbol("/") && toks.get(pos + 2).kind() == Kind.NUMBER) {
      suggestions.add(before.text() + " + " + t.text() + "/" + toks.get(pos + 2).text());
    }
    return new ToolException(new reckoner.tool.ToolError(ErrorCode.SYNTAX_ERROR, "two numbers with no operator between them at position "
        + position(t), suggestions));
  }

  private ToolException unexpected(Lexeme t) {
    if (t.isSymbol(")")) {
      return syntax("unmatched ')'", t);
    }
    if (t.isSymbol(",")) {
      return syntax("unexpected ','; commas separate function arguments or group digits in threes (1,000)", t);
    }
    if (t.isSymbol("=")) {
      return syntax("an equation: arith evaluates one expression, not an equality", t);
    }
    return syntax("unexpected '" + t.text() + "'", t);
  }

  private ToolException syntax(String what, Lexeme at) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, what + " at position " + position(at));
  }

  private String after(int i) {
    return i >= 0 && i < toks.size() ? " after '" + toks.get(i).text() + "'" : "";
  }

  private int position(Lexeme l) {
    return text.codePointCount(0, l.start()) + 1;
  }

  private static boolean isWhole(BigDecimal v) {
    return v.signum() == 0 || v.stripTrailingZeros().scale() <= 0;
  }
}
