package reckoner.arith;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.integers;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/**
 * Properties of arith@2 over generated expressions (QuickTheories, fixed seeds): exact evaluation
 * agrees with {@link BigDecimal} as the outside reference (exact where BigDecimal is, 300 digits
 * where a quotient does not terminate); every spelling of
 * one computation — symbols, words, a question, the text or the expr form — gives the same
 * canonical arguments (so the same cache entry) and the same answer; and the canonical expression
 * is a fixed point that answers like the phrase it came from.
 */
final class ArithV2PropertiesTest {
  private static final MathContext WIDE = new MathContext(300, RoundingMode.HALF_EVEN);
  private static final ArithToolV2 TOOL = new ArithToolV2();

  /**
   * A value computed with BigDecimal: exact where BigDecimal's unlimited arithmetic is (sums,
   * products, terminating quotients), otherwise carried at 300 digits and marked inexact.
   */
  record V(BigDecimal v, boolean exact) {
    V and(BigDecimal next, boolean stillExact) {
      return new V(next, exact && stillExact);
    }
  }

  /** A generated expression: printed fully parenthesised, and valued on BigDecimals. */
  interface Expr {
    String print();

    /** The value; ArithmeticException where arith must say domain_error. */
    V value();

    default boolean isPercent() {
      return false;
    }
  }

  private static boolean isExactZero(V v) {
    return v.exact() && v.v().signum() == 0;
  }

  private static V quotient(BigDecimal a, BigDecimal b) {
    try {
      return new V(a.divide(b), true);
    } catch (ArithmeticException nonTerminating) {
      if (b.signum() == 0) {
        throw nonTerminating;
      }
      return new V(a.divide(b, WIDE), false);
    }
  }

  record Lit(BigDecimal v) implements Expr {
    public String print() { return v.toPlainString(); }
    public V value() { return new V(v, true); }
  }

  record Neg(Expr x) implements Expr {
    public String print() { return "-(" + x.print() + ")"; }
    public V value() { V a = x.value(); return a.and(a.v().negate(), true); }
    public boolean isPercent() { return x.isPercent(); }
  }

  record Percent(Expr x) implements Expr {
    public String print() { return "(" + x.print() + ")%"; }
    public V value() { V a = x.value(); return a.and(a.v().movePointLeft(2), true); }
    public boolean isPercent() { return true; }
  }

  record Pow(Lit base, int n) implements Expr {
    public String print() { return "(" + base.print() + ")^(" + n + ")"; }
    public V value() {
      BigDecimal b = base.v();
      if (n >= 0) return new V(b.pow(n), true);
      if (b.signum() == 0) throw new ArithmeticException("0 to a negative power");
      return quotient(BigDecimal.ONE, b.pow(-n));
    }
  }

  record Bin(char op, Expr l, Expr r) implements Expr {
    public String print() {
      return "(" + l.print() + ") " + (op == 'm' ? "mod" : String.valueOf(op)) + " (" + r.print() + ")";
    }
    public V value() {
      V x = l.value();
      V y = r.value();
      boolean exact = x.exact() && y.exact();
      BigDecimal a = x.v();
      BigDecimal b = y.v();
      // The documented percentage rule: a + p% is a * (1 + p/100) unless a is a percentage too.
      if ((op == '+' || op == '-') && r instanceof Percent && !l.isPercent()) {
        BigDecimal change = a.multiply(b);
        return new V(op == '+' ? a.add(change) : a.subtract(change), exact || isExactZero(x));
      }
      switch (op) {
        case '+': return new V(a.add(b), exact);
        case '-': return new V(a.subtract(b), exact);
        case '*': return new V(a.multiply(b), exact || isExactZero(x) || isExactZero(y));
        case '/': {
          V q = quotient(a, b);
          return new V(q.v(), exact && q.exact() || isExactZero(x) && b.signum() != 0);
        }
        default: {
          // Floored modulo: a - b * floor(a / b), exact on decimals; a jump where a/b is whole, so an
          // inexact operand leaves the reference unable to say which side of the jump it is on.
          if (!exact) {
            throw new IllegalStateException("no reference for mod of an inexact operand");
          }
          BigDecimal q = a.divideToIntegralValue(b);
          if (a.subtract(b.multiply(q)).signum() != 0 && a.signum() * b.signum() < 0) {
            q = q.subtract(BigDecimal.ONE);
          }
          return new V(a.subtract(b.multiply(q)), exact);
        }
      }
    }
    public boolean isPercent() { return (op == '+' || op == '-') && l.isPercent() && r.isPercent(); }
  }

  static Gen<Lit> literals() {
    return in -> {
      long kind = in.next(Constraint.between(0, 9));
      BigDecimal d;
      if (kind < 4) {
        d = BigDecimal.valueOf(in.next(Constraint.between(0, 999_999_999)), 4);
      } else if (kind < 7) {
        d = BigDecimal.valueOf(in.next(Constraint.between(0, 40)));
      } else {
        d = BigDecimal.valueOf(in.next(Constraint.between(0, 99_999)) * 10 + 5, 3); // ties at two places
      }
      BigDecimal s = d.stripTrailingZeros();
      return new Lit(s.scale() < 0 ? s.setScale(0) : s);
    };
  }

  static Gen<Expr> exprs(int depth) {
    Gen<Lit> literals = literals();
    return in -> {
      long kind = depth == 0 ? 0 : in.next(Constraint.between(0, 9));
      if (kind < 2) {
        return literals.generate(in);
      }
      if (kind == 2) {
        Lit base = literals.generate(in);
        int n = (int) in.next(Constraint.between(-4, 6));
        return new Pow(base.v().compareTo(new BigDecimal("1000")) < 0 ? base : new Lit(BigDecimal.valueOf(7)), n);
      }
      if (kind == 3) {
        return new Neg(exprs(depth - 1).generate(in));
      }
      if (kind == 4) {
        return new Percent(exprs(depth - 1).generate(in));
      }
      char op = "+-*/m".charAt((int) in.next(Constraint.between(0, 4)));
      return new Bin(op, exprs(depth - 1).generate(in), exprs(depth - 1).generate(in));
    };
  }

  static Gen<String> modes() {
    return arbitrary().pick("half_even", "half_up", "half_down", "up", "down", "ceiling", "floor");
  }

  /* ------- exact evaluation against BigDecimal at 300 digits ------- */

  @Test
  void exactEvaluation_agreesWithBigDecimalAt300Digits() {
    int[] domainErrors = {0};
    int[] nearBoundary = {0};
    int[] noReference = {0};
    qt().withExamples(10_000).withFixedSeed(20261205L)
        .forAll(exprs(4), modes(), integers().between(0, 33), integers().between(0, 1))
        .checkAssert((expr, mode, n, useDigits) -> {
          String expected = expected(expr, mode, n, useDigits == 1);
          if (expected.equals("domain_error")) {
            domainErrors[0]++;
          }
          String actual = answer(args("expr", expr.print(), mode, n, useDigits == 1));
          if (expected.equals("?")) {
            noReference[0]++;
          } else if (expected.contains("|")) {
            nearBoundary[0]++;
            assertTrue(List.of(expected.split("\\|")).contains(actual), expr.print() + ": " + actual + " not in " + expected);
          } else {
            assertEquals(expected, actual, expr.print());
          }
        });
    assertTrue(domainErrors[0] < 2_000, "domain errors: " + domainErrors[0]);
  }

  /**
   * The reference answer. An inexact reference lying within 1e-250 of a rounding boundary cannot
   * tell which side the exact value is on: then both neighbours are acceptable, joined by '|'.
   */
  private static String expected(Expr expr, String mode, int n, boolean digits) {
    try {
      V value = expr.value();
      RoundingMode rm = RoundingMode.valueOf(mode.toUpperCase(Locale.ROOT));
      if (value.exact()) {
        return ArithPropertiesTest.format(round(value.v(), rm, n, digits));
      }
      BigDecimal eps = value.v().abs().add(BigDecimal.ONE).scaleByPowerOfTen(-250);
      String below = ArithPropertiesTest.format(round(value.v().subtract(eps), rm, n, digits));
      String above = ArithPropertiesTest.format(round(value.v().add(eps), rm, n, digits));
      return below.equals(above) ? below : below + "|" + above;
    } catch (ArithmeticException e) {
      return "domain_error";
    } catch (IllegalStateException e) {
      return "?";
    }
  }

  private static BigDecimal round(BigDecimal v, RoundingMode rm, int n, boolean digits) {
    return digits ? v.round(new MathContext(n + 1, rm)) : v.setScale(Math.min(n, 12), rm);
  }

  private static Map<String, Object> args(String form, String text, String mode, int n, boolean digits) {
    Map<String, Object> args = new LinkedHashMap<>();
    args.put(form, text);
    args.put("rounding", mode);
    args.put(digits ? "digits" : "places", digits ? n + 1 : Math.min(n, 12));
    return args;
  }

  private static String answer(Map<String, Object> args) {
    try {
      return TOOL.invoke(TOOL.canonicalize(Arguments.of(args)), CallContext.systemUtc()).text();
    } catch (ToolException e) {
      return e.error().code().wireName();
    }
  }

  private static Arguments canonical(Map<String, Object> args) throws ToolException {
    return TOOL.canonicalize(Arguments.of(args));
  }

  /* ------- the text and structured forms, and every spelling of one computation ------- */

  @Test
  void textAndStructuredForms_giveTheSameCanonicalArgumentsAndAnswer() {
    qt().withExamples(2_000).withFixedSeed(5L).forAll(exprs(3), modes(), integers().between(0, 8))
        .checkAssert((expr, mode, n) -> {
          Map<String, Object> text = args("text", expr.print(), mode, n, false);
          Map<String, Object> structured = args("expr", expr.print(), mode, n, false);
          assertEquals(canonicalOrError(text), canonicalOrError(structured), expr.print());
          assertEquals(answer(text), answer(structured), expr.print());
        });
  }

  private static String canonicalOrError(Map<String, Object> args) {
    try {
      return canonical(args).toCanonicalJson();
    } catch (ToolException e) {
      return e.error().text();
    }
  }

  /** Spellings of a op b: symbols, words and questions, each of which must mean the same. */
  private static List<String> spellings(String a, char op, String b) {
    List<String> s = new ArrayList<>();
    switch (op) {
      case '+' -> s.addAll(List.of(a + "+" + b, a + " + " + b, a + " plus " + b, "what is " + a + " plus " + b + "?",
          "What's " + a + " + " + b, "calculate " + a + " plus " + b, "add " + b + " to " + a, "the sum of " + a + " and " + b));
      case '-' -> s.addAll(List.of(a + "-" + b, a + " − " + b, a + " minus " + b, "what is " + a + " minus " + b + "?",
          "subtract " + b + " from " + a, "Compute: " + a + " - " + b + "."));
      case '*' -> s.addAll(List.of(a + "*" + b, a + " × " + b, a + " x " + b, a + " times " + b, a + " multiplied by " + b,
          "multiply " + a + " by " + b, "the product of " + a + " and " + b, "how much is " + a + " times " + b + "?"));
      case '/' -> s.addAll(List.of(a + "/" + b, a + " ÷ " + b, a + " divided by " + b, a + " over " + b,
          "divide " + a + " by " + b, "what is " + a + " divided by " + b + "?", "the quotient of " + a + " and " + b));
      default -> s.addAll(List.of(a + "% of " + b, a + " percent of " + b, "what is " + a + "% of " + b + "?",
          a + "% * " + b, a + " per cent of " + b, "How much is " + a + " percent of " + b));
    }
    return s;
  }

  @Test
  void everySpellingOfOneComputation_sharesOneCanonicalFormAndAnswer() {
    qt().withExamples(500).withFixedSeed(11L).forAll(literals(), arbitrary().pick('+', '-', '*', '/', '%'), literals(), modes())
        .checkAssert((a, op, b, mode) -> {
          String first = null;
          String firstAnswer = null;
          for (String spelling : spellings(a.print(), op, b.print())) {
            for (String form : new String[] {"text", "expr"}) {
              Map<String, Object> args = args(form, spelling, mode, 4, false);
              String c = canonicalOrError(args);
              String ans = answer(args);
              if (first == null) {
                first = c;
                firstAnswer = ans;
              }
              assertEquals(first, c, spelling);
              assertEquals(firstAnswer, ans, spelling);
            }
          }
        });
  }

  /* ------- the canonical form ------- */

  @Test
  void canonicalExpression_isAFixedPoint_andAnswersLikeThePhrase() {
    qt().withExamples(3_000).withFixedSeed(17L).forAll(exprs(4), modes(), integers().between(0, 10))
        .checkAssert((expr, mode, n) -> {
          Map<String, Object> args = args("text", expr.print(), mode, n, true);
          try {
            Arguments once = canonical(args);
            Map<String, Object> again = new LinkedHashMap<>(once.asMap());
            assertEquals(once, canonical(again), expr.print());
            assertEquals(answer(args), answer(again), expr.print());
          } catch (ToolException e) {
            throw new AssertionError(expr.print() + ": " + e.error().text(), e);
          }
        });
  }
}
