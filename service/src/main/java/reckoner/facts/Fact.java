package reckoner.facts;

import java.time.LocalDate;

/**
 * One stored value of a key, valid on the half-open interval {@code [from, to)}; a null bound is
 * open (no start, or no end). Immutable.
 */
record Fact(String value, LocalDate from, LocalDate to) {
  boolean isTimeScoped() {
    return from != null || to != null;
  }

  /** Whether the value holds on {@code date}: {@code from <= date < to}. */
  boolean isValidOn(LocalDate date) {
    return (from == null || !date.isBefore(from)) && (to == null || date.isBefore(to));
  }
}
