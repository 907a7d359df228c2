package reckoner.units;

import java.util.Objects;

/**
 * A parsed unit expression: its exact scale relative to the coherent SI unit of its dimension,
 * and, for a bare temperature scale, its offset. Immutable.
 *
 * @param factor one of this unit is {@code factor} coherent SI units
 * @param dimension the physical dimension
 * @param offset added before scaling; non-zero only for a bare °C or °F
 * @param interval whether the expression is a bare temperature-difference unit (Δ°C, Δ°F)
 * @param simple whether the expression is one unit word (possibly prefixed), nothing combined
 */
record Unit(Factor factor, Dimension dimension, Rational offset, boolean interval, boolean simple) {
  Unit {
    Objects.requireNonNull(factor, "factor");
    Objects.requireNonNull(dimension, "dimension");
    Objects.requireNonNull(offset, "offset");
  }

  static Unit of(Factor factor, Dimension dimension) {
    return new Unit(factor, dimension, Rational.ZERO, false, false);
  }

  boolean hasOffset() {
    return !offset.isZero();
  }
}
