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
 * and inside it — into an expression tree and the rounding the phrase asks for. {@link PhraseFrame}
 * takes the words around the expression off, this class is a precedence climbing parser over the
 * rest, and {@link WordPhrases} reads the constructs written in words; see
 * {@code tool-specs/arith/2.json} for the grammar. A phrase with two readings is refused ({@link Ambiguous}) unless the caller picks one
 * through {@link Readings}, which is how the tool prints both readings for the error. Not
 * thread-safe; one instance parses one text.
 */
final class PhraseParser extends WordPhrases {
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

  /**
   * Bounds on one text: its length, how deep parentheses nest, how deep the expression nests. A
   * caller's text gets {@link #CALLER}; a canonical expression, which this tool printed and which
   * spells out in parentheses what the caller wrote without them (sqrt sqrt 2 is sqrt(sqrt(2))),
   * gets {@link #CANONICAL}, wide enough for every canonical form of a text within CALLER.
   */
  record Limits(int length, int parentheses, int nesting) {
    static final Limits CALLER = new Limits(1000, 50, 200);
    static final Limits CANONICAL = new Limits(20_000, 250, 500);
  }

  static final int MAX_LENGTH = Limits.CALLER.length();

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

  private int depth;
  private int parenDepth;

  private final Limits limits;

  private PhraseParser(String text, Limits limits, Readings readings) {
    super(text, readings);
    this.limits = limits;
  }

  static Parsed parse(String text, Limits limits, Readings readings) throws ToolException, Ambiguous, UnknownWord {
    if (text.length() > limits.length()) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED,
          "the expression is " + text.length() + " characters long; the limit is " + limits.length());
    }
    return new PhraseParser(text, limits, readings).parseAll();
  }

  /** The phrase: its frame (PhraseFrame), then the expression, which must use every lexeme. */
  private Parsed parseAll() throws ToolException, Ambiguous, UnknownWord {
    List<Lexeme> all = new ArrayList<>();
    for (Lexeme l : PhraseLexer.lex(text)) {
      if (!l.isWord("the")) {
        all.add(l);
      }
    }
    PhraseFrame.Framed framed = PhraseFrame.frame(text, all);
    toks = framed.expression();
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
    return new Parsed(expr, framed.places(), framed.digits(), framed.rounding());
  }

  // =====================================================================================
  // Expressions: precedence climbing
  // =====================================================================================

  @Override
  Node expression(int rbp) throws ToolException, Ambiguous, UnknownWord {
    enter();
    try {
      return continueFrom(prefix(), rbp);
    } finally {
      depth--;
    }
  }

  /** Applies infix and postfix operators binding tighter than {@code rbp} to {@code left}. */
  @Override
  Node continueFrom(Node left, int rbp) throws ToolException, Ambiguous, UnknownWord {
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

  @Override
  int nextOperatorPower(Node left) throws ToolException, Ambiguous {
    Infix in = infix(left);
    return in == null ? -1 : in.power;
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
    return l.kind() == Kind.NUMBER && allDigits(l.text());
  }

  private static boolean allDigits(String s) {
    for (int i = 0; i < s.length(); i++) {
      if (s.charAt(i) < '0' || s.charAt(i) > '9') {
        return false;
      }
    }
    return true;
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

  @Override
  Node group() throws ToolException, Ambiguous, UnknownWord {
    Lexeme open = toks.get(pos);
    if (++parenDepth > limits.parentheses()) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "parentheses nest deeper than " + limits.parentheses() + " levels");
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
    while (pos < end && toks.get(pos).kind() == Kind.WORD && (NumberWords.SCALES.containsKey(toks.get(pos).text())
        || toks.get(pos).text().equals("hundred") || toks.get(pos).text().equals("dozen"))) {
      String scale = toks.get(pos).text();
      value = scale.equals("dozen") ? value.multiply(BigDecimal.valueOf(12))
          : value.scaleByPowerOfTen(scale.equals("hundred") ? 2 : NumberWords.SCALES.get(scale));
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
    return !inCallArguments && w.length() >= 1 && w.length() <= 3 && allDigits(w);
  }

  private static boolean isGroup(Lexeme l) {
    return l.kind() == Kind.NUMBER && l.text().matches("[0-9]{3}(\\.[0-9]+)?");
  }

  private static Node fraction(Lexeme f) {
    return new Bin(Op.DIV, new Num(f.value()), Num.of(f.denominator()));
  }

  /** A signed whole exponent as a tree: 2 or -(3). */
  private static Node signedInteger(BigDecimal v) {
    return v.signum() < 0 ? new Node.Neg(new Num(v.negate())) : new Num(v);
  }

  @Override
  Node wordPrefix(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
    if (NumberWords.SMALL_NUMBERS.containsKey(w) || w.contains("-") && NumberWords.SMALL_NUMBERS.containsKey(w.substring(0, w.indexOf('-')))) {
      return numberWords();
    }
    if (NumberWords.ORDINAL_WORDS.containsKey(w) && wordsAt(pos + 1, "root")) {
      pos += 2;
      return Call.of(Fn.ROOT, wordOperand(t), Num.of(NumberWords.ORDINAL_WORDS.get(w)));
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

  /** '(' arguments ')': comma-separated expressions; digits are never grouped inside. */
  @Override
  List<Node> arguments(Lexeme name) throws ToolException, Ambiguous, UnknownWord {
    Lexeme open = toks.get(pos);
    if (++parenDepth > limits.parentheses()) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "parentheses nest deeper than " + limits.parentheses() + " levels");
    }
    pos++;
    // sum([1, 2, 3]), max([3, 7]): a list written as one bracketed argument, as in Python.
    boolean bracketed = false;
    if (LIST_FUNCTIONS.contains(name.text()) && pos < end && toks.get(pos).isSymbol("(")) {
      int close = PhraseFrame.matchingParen(toks, pos, end);
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
    if (++depth > limits.nesting()) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the expression nests deeper than " + limits.nesting() + " levels");
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

}
