package reckoner.arith;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Map;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.integers;

import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/**
 * arith@1 against {@link java.math.BigDecimal} as the outside reference: generated expression
 * trees (QuickTheories, fixed seeds) are printed with minimal parentheses (so precedence and associativity are exercised), then
 * evaluated twice: by the tool from the text, and here directly on the tree with BigDecimal's own
 * operations (MathContext.DECIMAL128 per operation, {@code setScale}/{@code round} for the final
 * rounding). The two must give the same text. Ties are generated on purpose.
 */
final class ArithPropertiesTest {
  private static final MathContext MC = MathContext.DECIMAL128;

  /** An expression tree; {@code value} throws ArithmeticException where the tool must say domain_error. */
  interface Node {
    int precedence(); // 1: + -, 2: * / %, 3: unary minus, 4: ^, 5: literal

    String print();

    BigDecimal value();
  }

  record Lit(BigDecimal v) implements Node {
    public int precedence() { return 5; }
    public String print() { return v.toPlainString(); }
    public BigDecimal value() { return v; }
  }

  record Neg(Node x) implements Node {
    public int precedence() { return 3; }
    public String print() { return "-" + (x.precedence() >= 4 ? x.print() : "(" + x.print() + ")"); }
    public BigDecimal value() { return x.value().negate(); }
  }

  record Pow(Lit base, int n) implements Node {
    public int precedence() { return 4; }
    public String print() { return base.print() + "^" + (n < 0 ? "(" + n + ")" : Integer.toString(n)); }
    public BigDecimal value() {
      BigDecimal b = base.value();
      if (n == 0) return BigDecimal.ONE;
      if (n > 0) return b.pow(n).round(MC);
      if (b.signum() == 0) throw new ArithmeticException("0 to a negative power");
      return BigDecimal.ONE.divide(b.pow(-n), MC);
    }
  }

  record Bin(char op, Node l, Node r) implements Node {
    public int precedence() { return op == '+' || op == '-' ? 1 : 2; }
    public String print() {
      // Left-associative: a left child of equal precedence needs no parentheses; a right one does.
      String left = l.precedence() >= precedence() ? l.print() : "(" + l.print() + ")";
      String right = r.precedence() > precedence() && !(r instanceof Neg) ? r.print() : "(" + r.print() + ")";
      return left + " " + op + " " + right;
    }
    public BigDecimal value() {
      BigDecimal a = l.value();
      BigDecimal b = r.value();
      switch (op) {
        case '+': return a.add(b, MC);
        case '-': return a.subtract(b, MC);
        case '*': return a.multiply(b, MC);
        case '/': return a.divide(b, MC); // ArithmeticException on zero
        default: return a.remainder(b).round(MC); // ArithmeticException on zero
      }
    }
  }

  /** Literals: four-place decimals, small whole numbers, and ties (a 5 in the last of three places). */
  static Gen<Lit> literals() {
    return in -> {
      long kind = in.next(Constraint.between(0, 9));
      BigDecimal d;
      if (kind < 4) {
        d = BigDecimal.valueOf(in.next(Constraint.between(0, 999_999_999)), 4);
      } else if (kind < 7) {
        d = BigDecimal.valueOf(in.next(Constraint.between(0, 40)));
      } else {
        d = BigDecimal.valueOf(in.next(Constraint.between(0, 99_999)) * 10 + 5, 3);
      }
      BigDecimal s = d.stripTrailingZeros();
      return new Lit(s.scale() < 0 ? s.setScale(0) : s);
    };
  }

  static Gen<Node> nodes(int depth) {
    Gen<Lit> literals = literals();
    return in -> {
      long kind = depth == 0 ? 0 : in.next(Constraint.between(0, 8));
      if (kind < 2) {
        return literals.generate(in);
      }
      if (kind == 2) {
        Lit base = literals.generate(in);
        int n = (int) in.next(Constraint.between(-3, 4));
        return new Pow(base.v().compareTo(new BigDecimal("1000")) < 0 ? base : new Lit(BigDecimal.valueOf(7)), n);
      }
      if (kind == 3) {
        return new Neg(nodes(depth - 1).generate(in));
      }
      char op = "+-*/%".charAt((int) in.next(Constraint.between(0, 4)));
      return new Bin(op, nodes(depth - 1).generate(in), nodes(depth - 1).generate(in));
    };
  }

  static Gen<String> modes() {
    return arbitrary().pick("half_even", "half_up", "half_down", "up", "down", "ceiling", "floor");
  }

  @Test
  void tool_agreesWithBigDecimal_on10000Expressions() {
    int[] domainErrors = {0};
    qt().withExamples(10_000).withFixedSeed(20261201L)
        .forAll(nodes(4), modes(), integers().between(0, 8), integers().between(0, 1))
        .checkAssert((expr, mode, places, useDigits) -> {
          String expected = expected(expr, mode, places, useDigits == 1);
          if (expected.equals("domain_error")) {
            domainErrors[0]++;
          }
          assertEquals(expected, actual(expr.print(), mode, places, useDigits == 1), expr.print());
        });
    // The generator must mostly make computable expressions, or the check above proves little.
    org.junit.jupiter.api.Assertions.assertTrue(domainErrors[0] < 2_000, "domain errors: " + domainErrors[0]);
  }

  /** A literal with a tie in its last digit, rounded one place shorter, against {@code setScale}. */
  @Test
  void ties_roundLikeBigDecimal() {
    qt().withExamples(2_000).withFixedSeed(7L).forAll(literals(), modes()).checkAssert((lit, mode) -> {
      int places = Math.max(0, lit.v().scale() - 1);
      RoundingMode rm = RoundingMode.valueOf(mode.toUpperCase(java.util.Locale.ROOT));
      assertEquals(format(lit.v().negate().setScale(places, rm)), actual("-" + lit.print(), mode, places, false));
    });
  }

  private static String expected(Node expr, String mode, int places, boolean digits) {
    try {
      BigDecimal exact = expr.value();
      RoundingMode rm = RoundingMode.valueOf(mode.toUpperCase(java.util.Locale.ROOT));
      return format(digits ? exact.round(new MathContext(places + 1, rm)) : exact.setScale(places, rm));
    } catch (ArithmeticException e) {
      return "domain_error";
    }
  }

  private static String actual(String expr, String mode, int places, boolean digits) {
    ArithTool tool = new ArithTool();
    Map<String, Object> args = digits
        ? Map.of("expr", expr, "rounding", mode, "digits", places + 1)
        : Map.of("expr", expr, "rounding", mode, "places", places);
    try {
      return tool.invoke(tool.canonicalize(Arguments.of(args)), CallContext.systemUtc()).text();
    } catch (ToolException e) {
      return e.error().code().wireName();
    }
  }

  /** The contract's number rules, written independently of DecimalText. */
  static String format(BigDecimal x) {
    if (x.signum() == 0) {
      return "0";
    }
    BigDecimal s = x.stripTrailingZeros();
    BigDecimal abs = s.abs();
    if (abs.compareTo(new BigDecimal("1e21")) < 0 && abs.compareTo(new BigDecimal("1e-6")) >= 0) {
      return s.toPlainString();
    }
    String digits = s.unscaledValue().abs().toString();
    int exp = s.precision() - s.scale() - 1;
    String mantissa = digits.length() == 1 ? digits : digits.charAt(0) + "." + digits.substring(1);
    return (s.signum() < 0 ? "-" : "") + mantissa + "e" + (exp < 0 ? "-" : "+") + Math.abs(exp);
  }
}
