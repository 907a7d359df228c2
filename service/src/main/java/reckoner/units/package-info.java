/**
 * {@code units}: exact unit conversion. A unit expression is parsed by the package's own grammar
 * against a sourced unit table ({@code units/units-1.tsv} for units@1, {@code units/units-2.tsv}
 * for units@2); factors are exact rationals times a power of pi until the one final rounding.
 *
 * <p>Design notes: depends on {@code reckoner.tool} and the JDK only (no binary doubles, no
 * locale). {@link reckoner.units.UnitsTool} (units@1) and {@link reckoner.units.UnitsToolV2}
 * (units@2) are the entries; the table, parser, converter and rounding are package-private and
 * shared. units@2 adds, on top and without changing units@1: how words are read beyond the exact
 * table ({@code SystemReadings}, asked by the parser only where units@1 refuses), the reading of
 * a call's units together ({@code Resolver}), amounts ({@code Amounts}), quantities in parts
 * ({@code Quantity}), the text form ({@code Phrasing}), targets in parts ({@code Breakdown}) and
 * the nearest phrase a refusal names ({@code Nearest}). A table file is part of its version.
 */
package reckoner.units;
