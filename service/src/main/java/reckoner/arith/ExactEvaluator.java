package reckoner.arith;

import java.util.ArrayList;
import java.util.List;
import reckoner.tool.ToolException;

/**
 * Evaluates a tree on exact rationals: every + - * / mod and whole power is exact, so the one
 * rounding is the final one. When a value would outgrow {@link Rational#MAX_BITS} this gives up
 * with {@link Rational.TooLarge}, and the tool evaluates the tree again with
 * {@link BoundedEvaluator}. Stateless.
 */
final class ExactEvaluator {
  private static final Rational HUNDRED = Rational.of(100);
  private static final Rational ONE_EIGHTY = Rational.of(180);

  private ExactEvaluator() {}

  static Rational evaluate(Node node) throws ToolException, Rational.TooLarge {
    if (node instanceof Node.Num n) {
      return Rational.of(n.value());
    }
    if (node instanceof Node.Const c) {
      return RealFunctions.constant(c.name());
    }
    if (node instanceof Node.Neg n) {
      return evaluate(n.x()).negate();
    }
    if (node instanceof Node.Bin b) {
      return binary(b);
    }
    if (node instanceof Node.Percent p) {
      return evaluate(p.x()).divide(HUNDRED);
    }
    if (node instanceof Node.PercentChange p) {
      Rational base = evaluate(p.base());
      Rational change = base.multiply(evaluate(p.percent())).divide(HUNDRED);
      return p.increase() ? base.add(change) : base.subtract(change);
    }
    if (node instanceof Node.Factorial f) {
      return RealFunctions.factorial(evaluate(f.x()));
    }
    if (node instanceof Node.Degrees d) {
      return evaluate(d.x()).multiply(RealFunctions.constant("pi")).divide(ONE_EIGHTY);
    }
    if (node instanceof Node.Call c) {
      Node degrees = c.fn().isTrigonometric() ? Node.Degrees.amount(c.args().get(0)) : null;
      if (degrees != null) {
        return RealFunctions.trigDegrees(c.fn(), evaluate(degrees));
      }
      List<Rational> args = new ArrayList<>(c.args().size());
      for (Node a : c.args()) {
        args.add(evaluate(a));
      }
      return RealFunctions.apply(c.fn(), args);
    }
    throw new IllegalStateException("unknown node " + node);
  }

  private static Rational binary(Node.Bin b) throws ToolException, Rational.TooLarge {
    Rational l = evaluate(b.left());
    Rational r = evaluate(b.right());
    return switch (b.op()) {
      case ADD -> l.add(r);
      case SUB -> l.subtract(r);
      case MUL -> l.multiply(r);
      case DIV -> l.divide(r);
      case MOD -> l.remainder(r, true);
      case CHOOSE -> RealFunctions.choose(l, r);
      case POW -> RealFunctions.power(l, r, b.left() instanceof Node.Const c && c.name().equals("e"));
    };
  }
}
