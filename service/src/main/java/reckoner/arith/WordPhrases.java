package reckoner.arith;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import reckoner.arith.Node.Bin;
import reckoner.arith.Node.Call;
import reckoner.arith.Node.Fn;
import reckoner.arith.Node.Num;
import reckoner.arith.Node.Op;
import reckoner.arith.PhraseLexer.Kind;
import reckoner.arith.PhraseLexer.Lexeme;
import reckoner.arith.PhraseParser.Ambiguity;
import reckoner.arith.PhraseParser.Ambiguous;
import reckoner.arith.PhraseParser.Choice;
import reckoner.arith.PhraseParser.Readings;
import reckoner.arith.PhraseParser.UnknownWord;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * The English side of {@link PhraseParser}: the cursor over a phrase's lexemes and the
 * constructs written in words — verbs (add A to B), lists (the average of A, B and C), percentage
 * questions, remainders, differences, logarithms with a base, library names (math.log) and the
 * operands of function words (square root of x), including the readings they can have. The
 * expression grammar itself is the subclass's. Not thread-safe; one instance parses one text.
 */
abstract class WordPhrases {
  static final int ADDITIVE = 10;
  static final int MULTIPLICATIVE = 20;
  static final int PREFIX = 30;
  static final int POWER = 40;
  static final int POSTFIX = 50;
  /** "as a percentage" applies to everything before it. */
  static final int WHOLE = 1;

  final String text;
  final Readings readings;
  List<Lexeme> toks;
  int pos;
  int end;
  /** Inside a function's parenthesised arguments: commas separate, never group digits. */
  boolean inCallArguments;
  /** Inside a word list ("average of 3, 5 and 10"): commas separate. */
  boolean inWordList;
  /** The position just after the last ')' that closed a group. */
  int lastGroupEnd = -1;

  WordPhrases(String text, Readings readings) {
    this.text = text;
    this.readings = readings;
  }

  /** An expression of operators binding tighter than {@code rbp}. */
  abstract Node expression(int rbp) throws ToolException, Ambiguous, UnknownWord;

  /** Applies the operators binding tighter than {@code rbp} that follow {@code left}. */
  abstract Node continueFrom(Node left, int rbp) throws ToolException, Ambiguous, UnknownWord;

  /** The binding power of the operator at the cursor after {@code left}, or -1 if none. */
  abstract int nextOperatorPower(Node left) throws ToolException, Ambiguous;

  /** '(' arguments ')' at the cursor. */
  abstract List<Node> arguments(Lexeme name) throws ToolException, Ambiguous, UnknownWord;

  /** '(' expression ')' at the cursor. */
  abstract Node group() throws ToolException, Ambiguous, UnknownWord;

  /** The operand that starts with the word {@code t} at the cursor. */
  abstract Node wordPrefix(Lexeme t) throws ToolException, Ambiguous, UnknownWord;

  /** "a" or "an" before a count word: a hundred, a million, a half, a third of. */
  Node article(Lexeme t) throws ToolException, UnknownWord {
    if (pos + 1 < end && toks.get(pos + 1).kind() == Kind.WORD) {
      String next = toks.get(pos + 1).text();
      if (next.equals("hundred") || next.equals("dozen") || NumberWords.SCALES.containsKey(next)) {
        pos++;
        return numberWords();
      }
      if (NumberWords.FRACTION_WORDS.containsKey(next)) {
        pos++;
        return fractionWords(Num.of(1));
      }
    }
    throw new UnknownWord("unknown word '" + t.text() + "' at position " + position(t), t.start(), t.end());
  }

  /** Cardinal number words: "two hundred five thousand", "twenty-five", "three point one four". */
  Node numberWords() throws ToolException {
    BigDecimal total = BigDecimal.ZERO;
    BigDecimal current = BigDecimal.ZERO;
    boolean any = false;
    if (toks.get(pos).isWord("a") || toks.get(pos).isWord("an")) {
      current = BigDecimal.ONE;
      pos++;
    }
    while (pos < end && toks.get(pos).kind() == Kind.WORD) {
      String w = toks.get(pos).text();
      Integer small = NumberWords.smallNumber(w);
      if (small != null) {
        current = current.add(BigDecimal.valueOf(small));
      } else if (w.equals("hundred")) {
        current = (current.signum() == 0 ? BigDecimal.ONE : current).scaleByPowerOfTen(2);
      } else if (w.equals("dozen")) {
        current = (current.signum() == 0 ? BigDecimal.ONE : current).multiply(BigDecimal.valueOf(12));
      } else if (NumberWords.SCALES.containsKey(w)) {
        total = total.add((current.signum() == 0 ? BigDecimal.ONE : current).scaleByPowerOfTen(NumberWords.SCALES.get(w)));
        current = BigDecimal.ZERO;
      } else if (w.equals("point") && any && pos + 1 < end && NumberWords.smallNumber(toks.get(pos + 1).text()) != null
          && NumberWords.smallNumber(toks.get(pos + 1).text()) < 10) {
        pos++;
        StringBuilder fraction = new StringBuilder();
        while (pos < end && toks.get(pos).kind() == Kind.WORD && NumberWords.smallNumber(toks.get(pos).text()) != null
            && NumberWords.smallNumber(toks.get(pos).text()) < 10) {
          fraction.append(NumberWords.smallNumber(toks.get(pos).text()));
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

  /** "two thirds", "3 quarters", "a half": a count followed by a fraction word. */
  Node fractionWords(Node count) {
    if (pos < end && toks.get(pos).kind() == Kind.WORD && NumberWords.FRACTION_WORDS.containsKey(toks.get(pos).text())
        && !(pos + 1 < end && toks.get(pos + 1).isWord("root"))) {
      int d = NumberWords.FRACTION_WORDS.get(toks.get(pos).text());
      pos++;
      return new Bin(Op.DIV, count, Num.of(d));
    }
    return count;
  }

  /** "add A to B", "subtract A from B", "multiply A by B", "divide A by B", "increase A by B". */
  Node verb(Op op, Set<String> joiners, Lexeme verb) throws ToolException, Ambiguous, UnknownWord {
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
  Node whatPercent(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node percentChange(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node remainder(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node difference(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node quotient(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node listWord(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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

  boolean isListSeparator() {
    Lexeme l = toks.get(pos);
    return l.isSymbol(",") || l.isWord("and");
  }

  void skipListSeparator() {
    if (toks.get(pos).isSymbol(",") && pos + 1 < end && toks.get(pos + 1).isWord("and")) {
      pos++;
    }
    pos++;
  }

  Node combine(String w, List<Node> items, Lexeme t) throws ToolException {
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
  Node lastListItem() throws ToolException, Ambiguous, UnknownWord {
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

  /** "square root of x", "square of x", "cube root of x", "cube of x". */
  Node squareOrCube(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node logarithm(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node powCall(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node combCall(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
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
  Node libraryName(Lexeme name) throws ToolException, Ambiguous, UnknownWord {
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
  Node modCall(Lexeme t) throws ToolException, Ambiguous, UnknownWord {
    pos++;
    if (pos < end && toks.get(pos).isSymbol("(")) {
      List<Node> args = arguments(t);
      if (args.size() == 2) {
        return new Bin(Op.MOD, args.get(0), args.get(1));
      }
    }
    throw syntax("'mod' goes between two numbers (17 mod 5) or takes two arguments: mod(17, 5)", t);
  }

  /**
   * The operand of a function written without parentheses. After an English phrase ("square root
   * of"), an operator after the operand makes its extent unclear (WORD_OPERAND_EXTENT); formula
   * style (sqrt 16 + 9) binds like unary minus.
   */
  Node functionOperand(Lexeme name, boolean english) throws ToolException, Ambiguous, UnknownWord {
    if (pos < end && toks.get(pos).isWord("of")) {
      pos++;
      english = true;
    }
    return english ? wordOperand(name) : expression(PREFIX);
  }

  /** The operand of an English word operator (square root of, twice, half of); see above. */
  Node wordOperand(Lexeme first) throws ToolException, Ambiguous, UnknownWord {
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
      int next = nextOperatorPower(x);
      if (next > WHOLE && next < POSTFIX) {
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

  // ---- the cursor ----

  boolean wordsAt(int at, String... words) {
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

  boolean adjacent(int a, int b) {
    return toks.get(a).end() == toks.get(b).start();
  }

  void expectWord(String w, Lexeme phrase) throws ToolException {
    if (pos < end && toks.get(pos).isWord(w)) {
      pos++;
      return;
    }
    throw new ToolException(ErrorCode.SYNTAX_ERROR, "the phrase starting '" + phrase.text() + "' at position "
        + position(phrase) + " needs '" + w + "'" + (pos < end ? " where it has '" + toks.get(pos).text() + "'" : " before its end"));
  }

  ToolException syntax(String what, Lexeme at) {
    return new ToolException(ErrorCode.SYNTAX_ERROR, what + " at position " + position(at));
  }

  ToolException unexpected(Lexeme t) {
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

  String after(int i) {
    return i >= 0 && i < toks.size() ? " after '" + toks.get(i).text() + "'" : "";
  }

  int position(Lexeme l) {
    return text.codePointCount(0, l.start()) + 1;
  }

  static boolean isWhole(BigDecimal v) {
    return v.signum() == 0 || v.stripTrailingZeros().scale() <= 0;
  }

  /** {@code a + b%} is a percentage change of a (a * (1 + b/100)), unless a is itself a percentage. */
  static Node additive(Op op, Node left, Node right) {
    if (right instanceof Node.Percent p && !isPercentage(left)) {
      return new Node.PercentChange(left, p.x(), op == Op.ADD);
    }
    return new Bin(op, left, right);
  }

  static boolean isPercentage(Node n) {
    if (n instanceof Node.Percent) {
      return true;
    }
    if (n instanceof Node.Neg g) {
      return isPercentage(g.x());
    }
    return n instanceof Bin b && (b.op() == Op.ADD || b.op() == Op.SUB) && isPercentage(b.left()) && isPercentage(b.right());
  }
}
