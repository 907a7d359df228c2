package reckoner.arith;

import java.math.BigDecimal;
import java.util.List;
import java.util.Objects;

/**
 * The parsed form of an arith@2 expression. Parentheses leave no trace: two spellings that group
 * alike give equal trees, and {@link Canonical} prints a tree back to text that parses to an equal
 * tree. Immutable.
 */
sealed interface Node {
  /** A literal: non-negative, trailing zeros stripped, so equal values are equal literals. */
  record Num(BigDecimal value) implements Node {
    public Num {
      if (value.signum() < 0) {
        throw new IllegalArgumentException("literals are non-negative: " + value);
      }
      value = value.signum() == 0 ? BigDecimal.ZERO : value.stripTrailingZeros();
    }

    static Num of(long v) {
      return new Num(BigDecimal.valueOf(v));
    }
  }

  /** {@code pi} or {@code e}. */
  record Const(String name) implements Node {
    public Const {
      if (!name.equals("pi") && !name.equals("e")) {
        throw new IllegalArgumentException("unknown constant " + name);
      }
    }
  }

  record Neg(Node x) implements Node {
    public Neg {
      Objects.requireNonNull(x, "x");
    }
  }

  record Bin(Op op, Node left, Node right) implements Node {
    public Bin {
      Objects.requireNonNull(op, "op");
      Objects.requireNonNull(left, "left");
      Objects.requireNonNull(right, "right");
    }
  }

  /** {@code x%}: x / 100. */
  record Percent(Node x) implements Node {
    public Percent {
      Objects.requireNonNull(x, "x");
    }
  }

  /** {@code base + p%} or {@code base - p%}: base * (1 ± p/100). {@code percent} is p, without the sign. */
  record PercentChange(Node base, Node percent, boolean increase) implements Node {
    public PercentChange {
      Objects.requireNonNull(base, "base");
      Objects.requireNonNull(percent, "percent");
    }
  }

  record Factorial(Node x) implements Node {
    public Factorial {
      Objects.requireNonNull(x, "x");
    }
  }

  /** {@code x°}: x * pi / 180; the trigonometric functions take it exactly. */
  record Degrees(Node x) implements Node {
    public Degrees {
      Objects.requireNonNull(x, "x");
    }

    /**
     * The angle in degrees that {@code angle} is written as — x°, -x°, and sums and differences
     * of such — or null when it is not written in degrees.
     */
    static Node amount(Node angle) {
      if (angle instanceof Degrees d) {
        return d.x();
      }
      if (angle instanceof Neg n) {
        Node inner = amount(n.x());
        return inner == null ? null : new Neg(inner);
      }
      if (angle instanceof Bin b && (b.op() == Op.ADD || b.op() == Op.SUB)) {
        Node l = amount(b.left());
        Node r = amount(b.right());
        return l == null || r == null ? null : new Bin(b.op(), l, r);
      }
      return null;
    }
  }

  record Call(Fn fn, List<Node> args) implements Node {
    public Call {
      Objects.requireNonNull(fn, "fn");
      args = List.copyOf(args);
      if (args.size() < fn.minArgs || args.size() > fn.maxArgs) {
        throw new IllegalArgumentException(fn + " takes " + fn.minArgs + ".." + fn.maxArgs + " arguments: " + args.size());
      }
    }

    static Call of(Fn fn, Node... args) {
      return new Call(fn, List.of(args));
    }
  }

  /** The binary operators with their binding power (higher binds tighter). */
  enum Op {
    ADD("+", 10),
    SUB("-", 10),
    MUL("*", 20),
    DIV("/", 20),
    MOD("mod", 20),
    CHOOSE("choose", 20),
    POW("^", 40);

    final String symbol;
    final int power;

    Op(String symbol, int power) {
      this.symbol = symbol;
      this.power = power;
    }
  }

  /** The named functions and how many arguments each takes. */
  enum Fn {
    SQRT("sqrt", 1, 1),
    CBRT("cbrt", 1, 1),
    /** {@code root(x, n)}: the n-th root. */
    ROOT("root", 2, 2),
    ABS("abs", 1, 1),
    EXP("exp", 1, 1),
    LN("ln", 1, 1),
    LOG10("log10", 1, 1),
    LOG2("log2", 1, 1),
    /** {@code log_b(x)}: args are x, then the base b. */
    LOG_BASE("log_", 2, 2),
    SIN("sin", 1, 1),
    COS("cos", 1, 1),
    TAN("tan", 1, 1),
    ASIN("asin", 1, 1),
    ACOS("acos", 1, 1),
    ATAN("atan", 1, 1),
    FLOOR("floor", 1, 1),
    CEIL("ceil", 1, 1),
    TRUNC("trunc", 1, 1),
    MAX("max", 1, 100),
    MIN("min", 1, 100),
    /** Truncated remainder: the sign of the dividend. */
    REM("rem", 2, 2),
    GCD("gcd", 1, 100),
    LCM("lcm", 1, 100);

    final String wireName;
    final int minArgs;
    final int maxArgs;

    Fn(String wireName, int minArgs, int maxArgs) {
      this.wireName = wireName;
      this.minArgs = minArgs;
      this.maxArgs = maxArgs;
    }

    boolean isTrigonometric() {
      return this == SIN || this == COS || this == TAN;
    }
  }
}
