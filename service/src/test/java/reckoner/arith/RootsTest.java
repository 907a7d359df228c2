package reckoner.arith;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import java.math.BigDecimal;
import java.math.BigInteger;
import org.junit.jupiter.api.Test;

final class RootsTest {
  /** The definition of the integer root: r^n <= m < (r + 1)^n. */
  @Test
  void iroot_isTheFloorOfTheRoot() {
    qt().withExamples(3_000).withFixedSeed(3L).forAll(integers().between(1, 4_000), integers().between(2, 100), integers().between(0, 2))
        .checkAssert((bits, n, shape) -> {
          BigInteger m = switch (shape) {
            case 0 -> BigInteger.ONE.shiftLeft(bits).subtract(BigInteger.ONE); // all ones
            case 1 -> BigInteger.valueOf(bits).pow(n); // an exact power
            default -> BigInteger.ONE.shiftLeft(bits).add(BigInteger.valueOf(n)); // just above a power of two
          };
          BigInteger r = Roots.iroot(m, n);
          assertTrue(r.pow(n).compareTo(m) <= 0 && r.add(BigInteger.ONE).pow(n).compareTo(m) > 0, m + " root " + n + " gave " + r);
        });
  }

  @Test
  void rounded_matchesPythonDecimal() {
    // Python 3.11: decimal.Context(prec=34).sqrt(Decimal(2)); Decimal(2) ** (Decimal(1) / 3) at prec 60, rounded to 34.
    assertEquals(new BigDecimal("1.414213562373095048801688724209698"), Roots.rounded(Rational.of(2), 2));
    assertEquals(new BigDecimal("1.259921049894873164767210607278228"), Roots.rounded(Rational.of(2), 3));
  }
}
