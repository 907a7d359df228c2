package reckoner.arith;

import java.math.BigDecimal;
import java.util.stream.Collectors;

/**
 * Prints an expression tree as the canonical arith@2 expression: ASCII operators with single
 * spaces, the fewest parentheses that keep the grouping (plus a pair around a negative operand),
 * no implicit multiplication, functions by their canonical names. Parsing the printed text gives
 * an equal tree, so the text and structured forms of one call share one canonical form.
 */
final class Canonical {
  private static final int ADDITIVE = 10;
  private static final int PREFIX = 30;
  private static final int POWER = 40;
  private static final int POSTFIX = 50;
  private static final int ATOM = 60;

  private Canonical() {}

  static String print(Node node) {
    StringBuilder sb = new StringBuilder();
    print(node, sb);
    return sb.toString();
  }

  private static void print(Node node, StringBuilder sb) {
    if (node instanceof Node.Num n) {
      sb.append(number(n.value()));
    } else if (node instanceof Node.Const c) {
      sb.append(c.name());
    } else if (node instanceof Node.Neg n) {
      sb.append('-');
      child(n.x(), level(n.x()) < POWER && !(n.x() instanceof Node.Neg), sb); // --x, not -(-(x))
    } else if (node instanceof Node.Bin b) {
      binary(b, sb);
    } else if (node instanceof Node.PercentChange p) {
      child(p.base(), level(p.base()) < ADDITIVE, sb);
      sb.append(p.increase() ? " + " : " - ");
      print(new Node.Percent(p.percent()), sb);
    } else if (node instanceof Node.Percent p) {
      child(p.x(), level(p.x()) < POSTFIX, sb);
      sb.append('%');
    } else if (node instanceof Node.Factorial f) {
      child(f.x(), level(f.x()) < POSTFIX || f.x() instanceof Node.Factorial, sb); // (5!)!, never 5!!
      sb.append('!');
    } else if (node instanceof Node.Degrees d) {
      child(d.x(), level(d.x()) < POSTFIX, sb);
      sb.append('°');
    } else if (node instanceof Node.Call c) {
      call(c, sb);
    } else {
      throw new IllegalStateException("unknown node " + node);
    }
  }

  private static void binary(Node.Bin b, StringBuilder sb) {
    int p = b.op().power;
    if (b.op() == Node.Op.POW) {
      child(b.left(), level(b.left()) <= POWER, sb);
      sb.append(" ^ ");
      child(b.right(), level(b.right()) < POWER || b.right() instanceof Node.Neg, sb);
      return;
    }
    child(b.left(), level(b.left()) < p, sb);
    sb.append(' ').append(b.op().symbol).append(' ');
    child(b.right(), level(b.right()) <= p || b.right() instanceof Node.Neg, sb);
  }

  private static void call(Node.Call c, StringBuilder sb) {
    if (c.fn() == Node.Fn.LOG_BASE) {
      Node base = c.args().get(1);
      sb.append("log_");
      child(base, !(base instanceof Node.Num), sb);
      sb.append('(');
      print(c.args().get(0), sb);
      sb.append(')');
      return;
    }
    sb.append(c.fn().wireName).append('(');
    for (int i = 0; i < c.args().size(); i++) {
      if (i > 0) {
        sb.append(", ");
      }
      print(c.args().get(i), sb);
    }
    sb.append(')');
  }

  private static void child(Node node, boolean parenthesize, StringBuilder sb) {
    if (parenthesize) {
      sb.append('(');
      print(node, sb);
      sb.append(')');
    } else {
      print(node, sb);
    }
  }

  /** How tightly a printed node holds together: lower levels need parentheses in tighter places. */
  static int level(Node node) {
    if (node instanceof Node.Bin b) {
      return b.op().power;
    }
    if (node instanceof Node.PercentChange) {
      return ADDITIVE;
    }
    if (node instanceof Node.Neg) {
      return PREFIX;
    }
    if (node instanceof Node.Percent || node instanceof Node.Factorial || node instanceof Node.Degrees) {
      return POSTFIX;
    }
    return ATOM;
  }

  /** Plain notation from 1e-10 to below 1e21, otherwise {@code d.ddde+N}: never longer than needed. */
  static String number(BigDecimal v) {
    if (v.signum() == 0) {
      return "0";
    }
    int exponent = v.precision() - v.scale() - 1;
    if (exponent >= -10 && exponent < 21) {
      return v.toPlainString();
    }
    String digits = v.unscaledValue().toString();
    StringBuilder sb = new StringBuilder(digits.length() + 8).append(digits.charAt(0));
    if (digits.length() > 1) {
      sb.append('.').append(digits, 1, digits.length());
    }
    return sb.append('e').append(exponent < 0 ? '-' : '+').append(Math.abs(exponent)).toString();
  }

  static String list(java.util.List<Node> nodes) {
    return nodes.stream().map(Canonical::print).collect(Collectors.joining(", "));
  }
}
