/**
 * {@code dates}: calendar and duration arithmetic against a reference time, time-zone moves, and
 * dates shown in other calendar systems. java.time does the ISO work (proleptic Gregorian
 * calendar, ISO 8601 weeks, the JDK's copy of the IANA tz database); ICU4J supplies the other
 * calendar systems and the CLDR wording of {@code style=long}.
 *
 * <p>Design notes: depends on {@code reckoner.tool}, java.time and ICU4J only.
 * {@link reckoner.dates.DatesTool} is the entry; parsers, tables and arithmetic are
 * package-private. Nothing here reads the JVM's default locale, time zone or clock: the clock
 * comes from the {@link reckoner.tool.CallContext}, every zone and locale from the arguments.
 */
package reckoner.dates;
