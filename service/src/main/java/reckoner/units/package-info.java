/**
 * {@code units}: exact unit conversion. A unit expression is parsed by the package's own grammar
 * against a sourced unit table ({@code units/units-1.tsv}); factors are exact rationals times a
 * power of pi until the one final rounding.
 *
 * <p>Design notes: depends on {@code reckoner.tool} and the JDK only (no binary doubles, no
 * locale). {@link reckoner.units.UnitsTool} is the entry; the table, parser, converter and
 * rounding are package-private. The table file is part of the tool's version.
 */
package reckoner.units;
