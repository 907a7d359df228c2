package reckoner.units;

import java.math.BigInteger;
import java.util.List;

/**
 * The decimal SI prefixes (SI Brochure, 9th edition, Table 7, with ronna, quetta, ronto and quecto
 * added by the 27th CGPM, 2022, Resolution 3) and the binary prefixes of IEC 80000-13:2008,
 * clause 4, for bits and bytes. {@code u} is accepted as an ASCII stand-in for micro, and both
 * MICRO SIGN (U+00B5) and GREEK SMALL LETTER MU (U+03BC).
 */
enum Prefix {
  QUETTA("Q", "quetta", 10, 30),
  RONNA("R", "ronna", 10, 27),
  YOTTA("Y", "yotta", 10, 24),
  ZETTA("Z", "zetta", 10, 21),
  EXA("E", "exa", 10, 18),
  PETA("P", "peta", 10, 15),
  TERA("T", "tera", 10, 12),
  GIGA("G", "giga", 10, 9),
  MEGA("M", "mega", 10, 6),
  KILO("k", "kilo", 10, 3),
  HECTO("h", "hecto", 10, 2),
  DECA("da", "deca", 10, 1),
  DECI("d", "deci", 10, -1),
  CENTI("c", "centi", 10, -2),
  MILLI("m", "milli", 10, -3),
  MICRO("µ", "micro", 10, -6),
  NANO("n", "nano", 10, -9),
  PICO("p", "pico", 10, -12),
  FEMTO("f", "femto", 10, -15),
  ATTO("a", "atto", 10, -18),
  ZEPTO("z", "zepto", 10, -21),
  YOCTO("y", "yocto", 10, -24),
  RONTO("r", "ronto", 10, -27),
  QUECTO("q", "quecto", 10, -30),
  KIBI("Ki", "kibi", 2, 10),
  MEBI("Mi", "mebi", 2, 20),
  GIBI("Gi", "gibi", 2, 30),
  TEBI("Ti", "tebi", 2, 40),
  PEBI("Pi", "pebi", 2, 50),
  EXBI("Ei", "exbi", 2, 60),
  ZEBI("Zi", "zebi", 2, 70),
  YOBI("Yi", "yobi", 2, 80);

  /** Which prefixes a unit of the table takes (its {@code prefixes} column). */
  enum Policy {
    /** No prefix: customary units, and units whose prefixed forms would read as something else. */
    NONE("-"),
    /** Every decimal prefix (SI units, litre, electronvolt...). */
    ALL("si"),
    /** Decimal multiples from kilo up only (tonne: kt, Mt; annum: ka, Ma). */
    MULTIPLES("si+"),
    /** Decimal multiples from kilo up and the binary prefixes (bit, byte). */
    DATA("data");

    final String column;

    Policy(String column) {
      this.column = column;
    }

    static Policy parse(String column) {
      for (Policy p : values()) {
        if (p.column.equals(column)) {
          return p;
        }
      }
      throw new IllegalArgumentException("unknown prefix policy '" + column + "'; expected -, si, si+ or data");
    }

    boolean allows(Prefix prefix) {
      switch (this) {
        case ALL:
          return prefix.base == 10;
        case MULTIPLES:
          return prefix.base == 10 && prefix.exponent >= 3;
        case DATA:
          return prefix.base == 2 || prefix.exponent >= 3;
        default:
          return false;
      }
    }
  }

  final String symbol;
  final String word;
  final int base;
  final int exponent;

  Prefix(String symbol, String word, int base, int exponent) {
    this.symbol = symbol;
    this.word = word;
    this.base = base;
    this.exponent = exponent;
  }

  /** The exact factor, such as 1000 for kilo or 1024 for kibi. */
  Rational factor() {
    BigInteger b = BigInteger.valueOf(base);
    return exponent >= 0 ? Rational.of(b.pow(exponent), BigInteger.ONE) : Rational.of(BigInteger.ONE, b.pow(-exponent));
  }

  /** The spellings of the symbol accepted in input: micro has three. */
  List<String> inputSymbols() {
    return this == MICRO ? List.of("µ", "μ", "u") : List.of(symbol);
  }
}
