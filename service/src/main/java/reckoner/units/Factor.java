package reckoner.units;

import java.util.Objects;

/**
 * A unit's exact scale relative to the coherent SI unit of its dimension: a rational times a
 * whole power of pi. Pi enters through angles (degree = pi/180 rad) and a few definitions that
 * divide by pi (parsec, oersted); keeping it symbolic lets pi cancel exactly (degree to gon) and
 * be expanded only once, at the final rounding. Immutable.
 */
record Factor(Rational coefficient, int piPower) {
  static final Factor ONE = new Factor(Rational.ONE, 0);

  Factor {
    Objects.requireNonNull(coefficient, "coefficient");
  }

  static Factor of(Rational coefficient) {
    return new Factor(coefficient, 0);
  }

  Factor times(Factor other) {
    return new Factor(coefficient.times(other.coefficient), piPower + other.piPower);
  }

  Factor divide(Factor other) {
    return new Factor(coefficient.divide(other.coefficient), piPower - other.piPower);
  }

  Factor pow(int exponent) {
    return new Factor(coefficient.pow(exponent), piPower * exponent);
  }

  Factor reciprocal() {
    return new Factor(coefficient.reciprocal(), -piPower);
  }

  boolean isRational() {
    return piPower == 0;
  }

  @Override
  public String toString() {
    return piPower == 0 ? coefficient.toString() : coefficient + "*pi^" + piPower;
  }
}
