/**
 * {@code dates}: calendar and duration arithmetic against a reference time, time-zone moves, and
 * dates shown in other calendar systems. java.time does the ISO work (proleptic Gregorian
 * calendar, ISO 8601 weeks, the JDK's copy of the IANA tz database); ICU4J supplies the other
 * calendar systems and the CLDR wording of {@code style=long}. Version 2 adds the phrasings people
 * write ({@link reckoner.dates.DatesToolV2}), and the Jollyday library the public holidays of its
 * business days.
 *
 * <p>Design notes: depends on {@code reckoner.tool}, java.time, ICU4J, Jollyday and Caffeine (the
 * kept holiday sets) only. {@link reckoner.dates.DatesTool} and {@link reckoner.dates.DatesToolV2}
 * are the entries; version 2 shares version 1's readers and arithmetic where that leaves version
 * 1's answers as they were. Parsers, tables and arithmetic are
 * package-private. Nothing here reads the JVM's default locale, time zone or clock: the clock
 * comes from the {@link reckoner.tool.CallContext}, every zone and locale from the arguments.
 */
package reckoner.dates;
