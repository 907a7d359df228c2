package reckoner.dates;

import java.util.Arrays;
import java.util.Locale;
import java.util.Set;
import java.util.stream.Collectors;
import reckoner.tool.ToolException;

/**
 * The operations of {@code dates@1} and, for each, the arguments it takes: what {@code date} holds,
 * what {@code to} holds, and whether it reads the reference time or words its answer.
 */
enum Op {
  TODAY(DateKind.NONE, ToKind.NONE, Set.of("zone"), true, true),
  AGO(DateKind.NONE, ToKind.NONE, Set.of("duration", "zone"), true, true),
  ADD(DateKind.STAMP, ToKind.NONE, Set.of("date", "duration", "zone"), false, true),
  SUBTRACT(DateKind.STAMP, ToKind.NONE, Set.of("date", "duration", "zone"), false, true),
  BETWEEN(DateKind.DATE, ToKind.DATE, Set.of("date", "to", "unit"), false, false),
  WEEKDAY(DateKind.DATE, ToKind.NONE, Set.of("date"), false, true),
  ISO_WEEK(DateKind.DATE, ToKind.NONE, Set.of("date"), false, false),
  DAY_OF_YEAR(DateKind.DATE, ToKind.NONE, Set.of("date"), false, false),
  LEAP_YEAR(DateKind.YEAR, ToKind.NONE, Set.of("date"), false, false),
  DAYS_IN_MONTH(DateKind.YEAR_MONTH, ToKind.NONE, Set.of("date"), false, false),
  QUARTER(DateKind.DATE, ToKind.NONE, Set.of("date"), false, true),
  CONVERT_ZONE(DateKind.DATE_TIME, ToKind.ZONE, Set.of("date", "zone", "to"), false, true),
  TO_CALENDAR(DateKind.DATE, ToKind.NONE, Set.of("date", "calendar"), false, true),
  FROM_CALENDAR(DateKind.CALENDAR_DATE, ToKind.NONE, Set.of("date", "calendar"), false, true);

  /** What the {@code date} argument holds. */
  enum DateKind { NONE, DATE, STAMP, DATE_TIME, YEAR, YEAR_MONTH, CALENDAR_DATE }

  /** What the {@code to} argument holds. */
  enum ToKind { NONE, DATE, ZONE }

  private final String wireName = name().toLowerCase(Locale.ROOT);
  private final DateKind dateKind;
  private final ToKind toKind;
  private final Set<String> takes;
  private final boolean readsReferenceTime;
  private final boolean worded;

  Op(DateKind dateKind, ToKind toKind, Set<String> takes, boolean readsReferenceTime, boolean worded) {
    this.dateKind = dateKind;
    this.toKind = toKind;
    this.takes = takes;
    this.readsReferenceTime = readsReferenceTime;
    this.worded = worded;
  }

  String wireName() {
    return wireName;
  }

  DateKind dateKind() {
    return dateKind;
  }

  ToKind toKind() {
    return toKind;
  }

  /** The op-specific arguments it takes (besides op, as_of, style and locale, which every op accepts). */
  Set<String> takes() {
    return takes;
  }

  /** Whether the answer depends on the reference time ({@code as_of} or the clock). */
  boolean readsReferenceTime() {
    return readsReferenceTime;
  }

  /** Whether {@code style=long} words the answer; otherwise the answer is a number or a code. */
  boolean worded() {
    return worded;
  }

  static Op of(String text) throws ToolException {
    for (Op op : values()) {
      if (op.wireName.equals(text)) {
        return op;
      }
    }
    throw Problems.invalidArgument("op must be one of " + names() + " but was " + Problems.quote(text));
  }

  static String names() {
    return Arrays.stream(values()).map(Op::wireName).collect(Collectors.joining(", "));
  }
}
