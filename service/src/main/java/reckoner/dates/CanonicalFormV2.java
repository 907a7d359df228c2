package reckoner.dates;

import java.math.BigDecimal;
import java.time.DayOfWeek;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import reckoner.dates.WrittenDates.Kind;
import reckoner.dates.WrittenDates.Written;
import reckoner.tool.Arguments;
import reckoner.tool.ToolException;

/**
 * The canonical form of a version 2 call. The ops of version 1 keep version 1's canonical form,
 * after version 2's readings of their values (English dates into ISO 8601, city names into IANA
 * ids); {@code between} also takes a holiday {@code region}. The new ops get theirs here: values
 * normalised, defaults filled ({@code unit=days}, {@code shift=0}, {@code style}), and the reference
 * time ({@code as_of}, {@code zone}) kept only where the answer reads it. A missing, misplaced or
 * conflicting argument is invalid_argument (the request cannot be read as one call); a value that
 * cannot be computed has the family's own code. Pure functions; thread-safe.
 */
final class CanonicalFormV2 {
  static final String WEEKDAY = "weekday";
  static final String WHICH = "which";
  static final String N = "n";
  static final String PERIOD = "period";
  static final String SHIFT = "shift";
  static final String DAYS = "days";
  static final String REGION = "region";
  static final long MAX_BUSINESS_DAYS = 1_000_000_000L;
  static final long MAX_REGION_BUSINESS_DAYS = 20_000;
  private static final int MAX_SHIFT = 100_000;
  private static final Set<String> EVERY_OP = Set.of(CanonicalForm.OP, CanonicalForm.AS_OF, CanonicalForm.STYLE, CanonicalForm.LOCALE);

  /** The ops version 2 adds to version 1's. */
  enum NewOp {
    NOW(Set.of("zone"), Set.of(), true),
    FROM_NOW(Set.of("duration", "zone"), Set.of("duration"), true),
    RELATIVE_WEEKDAY(Set.of(WEEKDAY, WHICH, "zone"), Set.of(WEEKDAY, WHICH), true),
    UNTIL(Set.of("to", "unit", REGION, "zone"), Set.of("to"), false),
    SINCE(Set.of("date", "unit", REGION, "zone"), Set.of("date"), false),
    START_OF(Set.of(PERIOD, "date", SHIFT, "zone"), Set.of(PERIOD), true),
    END_OF(Set.of(PERIOD, "date", SHIFT, "zone"), Set.of(PERIOD), true),
    NTH_WEEKDAY(Set.of(WEEKDAY, N, "date", SHIFT, "zone"), Set.of(WEEKDAY, N), true),
    ADD_BUSINESS_DAYS(Set.of(DAYS, "date", REGION, "zone"), Set.of(DAYS), true),
    IS_BUSINESS_DAY(Set.of("date", REGION, "zone"), Set.of(), false),
    IS_HOLIDAY(Set.of("date", REGION, "zone"), Set.of(REGION), false);

    private final String wireName = name().toLowerCase(Locale.ROOT);
    private final Set<String> takes;
    private final Set<String> needs;
    private final boolean worded;

    NewOp(Set<String> takes, Set<String> needs, boolean worded) {
      this.takes = takes;
      this.needs = needs;
      this.worded = worded;
    }

    String wireName() {
      return wireName;
    }

    /** Whether the answer is a date that {@code style=long} words. */
    boolean worded() {
      return worded;
    }

    /** Whether the answer reads the reference time, given the canonical arguments. */
    boolean readsReferenceTime(Arguments canonical) {
      return switch (this) {
        case NOW, FROM_NOW, RELATIVE_WEEKDAY, UNTIL, SINCE -> true;
        default -> !canonical.has(CanonicalForm.DATE);
      };
    }

    static Optional<NewOp> of(String text) {
      for (NewOp op : values()) {
        if (op.wireName.equals(text)) {
          return Optional.of(op);
        }
      }
      return Optional.empty();
    }
  }

  private CanonicalFormV2() {}

  static Arguments of(Arguments in) throws ToolException {
    for (Map.Entry<String, Object> e : in.asMap().entrySet()) {
      if (e.getValue() instanceof String s) {
        Problems.requireVisible(e.getKey(), s);
      }
    }
    String opName = in.requireString(CanonicalForm.OP);
    Optional<NewOp> newOp = NewOp.of(opName);
    if (newOp.isPresent()) {
      return ofNew(newOp.get(), in);
    }
    Op op = Op.of(opName);
    if (op == Op.BETWEEN && in.has(REGION)) {
      Arguments v1 = CanonicalForm.of(valuesRead(op, in.without(REGION)));
      if (!v1.requireString(CanonicalForm.UNIT).equals("business_days")) {
        throw Problems.invalidArgument("a holiday region applies to unit business_days only; unit is " + v1.requireString(CanonicalForm.UNIT));
      }
      return v1.with(REGION, Holidays.region(in.requireString(REGION)));
    }
    return CanonicalForm.of(valuesRead(op, in));
  }

  /** Version 1's arguments with version 2's readings of dates and zone names. */
  private static Arguments valuesRead(Op op, Arguments in) throws ToolException {
    Arguments out = in;
    if (in.has(CanonicalForm.DATE) && op.dateKind() != Op.DateKind.CALENDAR_DATE && op.dateKind() != Op.DateKind.NONE) {
      out = out.with(CanonicalForm.DATE, written(in.requireString(CanonicalForm.DATE), op.dateKind()));
    }
    if (in.has(CanonicalForm.TO) && op.toKind() == Op.ToKind.DATE) {
      out = out.with(CanonicalForm.TO, written(in.requireString(CanonicalForm.TO), Op.DateKind.DATE));
    }
    if (in.has(CanonicalForm.TO) && op.toKind() == Op.ToKind.ZONE) {
      out = out.with(CanonicalForm.TO, zoneText(in.requireString(CanonicalForm.TO)));
    }
    if (in.has(CanonicalForm.ZONE)) {
      out = out.with(CanonicalForm.ZONE, zoneText(in.requireString(CanonicalForm.ZONE)));
    }
    if (in.has(CanonicalForm.AS_OF)) {
      out = out.with(CanonicalForm.AS_OF, written(in.requireString(CanonicalForm.AS_OF), Op.DateKind.STAMP));
    }
    return out;
  }

  /** A date value as ISO text when version 2 reads it; otherwise as given, for version 1 to read or refuse. */
  private static String written(String value, Op.DateKind kind) throws ToolException {
    List<String> words = Phrases.words(value);
    if (words.size() <= 1 && !value.contains("/") && !value.contains(".")) {
      return value; // an ISO value: version 1 reads it, with version 1's messages
    }
    Optional<Written> read = WrittenDates.read(words, 0, words.size());
    if (read.isEmpty()) {
      return value;
    }
    Kind k = read.get().kind();
    boolean fits = switch (kind) {
      case YEAR -> k == Kind.YEAR || k == Kind.DATE;
      case YEAR_MONTH -> k == Kind.YEAR_MONTH || k == Kind.DATE;
      case STAMP, DATE_TIME -> k == Kind.DATE || k == Kind.DATE_TIME;
      default -> k == Kind.DATE;
    };
    if (k == Kind.MONTH_DAY) {
      throw Suggestions.noYear(read.get().text());
    }
    return fits ? read.get().text() : value;
  }

  private static String zoneText(String value) throws ToolException {
    Optional<String> city = ZoneNames.city(value);
    return city.orElse(value);
  }

  /* ------------------------------------------------ the new ops ------------------------------------------------ */

  private static Arguments ofNew(NewOp op, Arguments in) throws ToolException {
    for (String name : in.asMap().keySet()) {
      if (!EVERY_OP.contains(name) && !op.takes.contains(name)) {
        throw Problems.invalidArgument("op '" + op.wireName + "' takes " + String.join(", ", new TreeSet<>(op.takes))
            + "; '" + name + "' does not apply");
      }
    }
    for (String name : op.needs) {
      if (!in.has(name)) {
        throw Problems.invalidArgument("op '" + op.wireName + "' needs '" + name + "'");
      }
    }
    Arguments out = Arguments.of(CanonicalForm.OP, op.wireName);
    switch (op) {
      case FROM_NOW -> out = out.with(CanonicalForm.DURATION, IsoDuration.parse(in.requireString(CanonicalForm.DURATION)).toString());
      case RELATIVE_WEEKDAY -> out = out.with(WEEKDAY, weekday(in.requireString(WEEKDAY)))
          .with(WHICH, oneOf(WHICH, in.requireString(WHICH), List.of("this", "next", "last")));
      case UNTIL -> out = span(in, out, CanonicalForm.TO);
      case SINCE -> out = span(in, out, CanonicalForm.DATE);
      case START_OF, END_OF -> {
        out = out.with(PERIOD, oneOf(PERIOD, in.requireString(PERIOD), List.of("week", "month", "quarter", "year")))
            .with(SHIFT, BigDecimal.valueOf(shift(in)));
        if (in.has(CanonicalForm.DATE)) {
          out = out.with(CanonicalForm.DATE, periodDate(in.requireString(CanonicalForm.DATE)));
        }
      }
      case NTH_WEEKDAY -> {
        int n = in.integer(N).orElseThrow();
        if (n < -1 || n == 0 || n > 5) {
          throw Problems.invalidArgument("n must be 1 to 5 (first to fifth) or -1 (last) but was " + n);
        }
        out = out.with(WEEKDAY, weekday(in.requireString(WEEKDAY))).with(N, BigDecimal.valueOf(n))
            .with(SHIFT, BigDecimal.valueOf(shift(in)));
        if (in.has(CanonicalForm.DATE)) {
          out = out.with(CanonicalForm.DATE, monthOf(in.requireString(CanonicalForm.DATE)));
        }
      }
      case ADD_BUSINESS_DAYS -> {
        BigDecimal days = in.requireNumber(DAYS);
        long count;
        try {
          count = days.longValueExact();
        } catch (ArithmeticException e) {
          throw Problems.invalidArgument("days must be a whole number but was " + days.toPlainString());
        }
        if (Math.abs(count) > MAX_BUSINESS_DAYS) {
          throw Problems.outOfRange("at most " + MAX_BUSINESS_DAYS + " business days can be added, not " + count);
        }
        out = out.with(DAYS, BigDecimal.valueOf(count));
        out = dateOrReference(in, out);
        out = region(in, out);
      }
      case IS_BUSINESS_DAY, IS_HOLIDAY -> {
        out = dateOrReference(in, out);
        out = region(in, out);
      }
      default -> { }
    }
    if (op.readsReferenceTime(out)) {
      out = referenceTime(in, out);
    } else if (in.has(CanonicalForm.ZONE)) {
      throw Problems.invalidArgument("a zone applies only where the answer reads the reference time; op '" + op.wireName
          + "' with a date does not");
    }
    return op.worded ? wording(in, out) : out;
  }

  /** until and since: the date (a date, or a month and day without a year), the unit and the holiday region. */
  private static Arguments span(Arguments in, Arguments out, String name) throws ToolException {
    out = out.with(name, dateOrMonthDay(in.requireString(name)));
    String unit = Spans.Unit.of(in.string(CanonicalForm.UNIT).orElse("days")).wireName();
    out = out.with(CanonicalForm.UNIT, unit);
    if (in.has(REGION)) {
      if (!unit.equals("business_days")) {
        throw Problems.invalidArgument("a holiday region applies to unit business_days only; unit is " + unit);
      }
      out = out.with(REGION, Holidays.region(in.requireString(REGION)));
    }
    return out;
  }

  private static Arguments dateOrReference(Arguments in, Arguments out) throws ToolException {
    return in.has(CanonicalForm.DATE) ? out.with(CanonicalForm.DATE, date(in.requireString(CanonicalForm.DATE))) : out;
  }

  private static Arguments region(Arguments in, Arguments out) throws ToolException {
    return in.has(REGION) ? out.with(REGION, Holidays.region(in.requireString(REGION))) : out;
  }

  private static int shift(Arguments in) throws ToolException {
    int shift = in.integer(SHIFT).orElse(0);
    if (Math.abs(shift) > MAX_SHIFT) {
      throw Problems.outOfRange("shift must be within ±" + MAX_SHIFT + " but was " + shift);
    }
    return shift;
  }

  /** A date: ISO 8601 or written in English. */
  static String date(String value) throws ToolException {
    List<String> words = Phrases.words(value);
    Optional<Written> read = WrittenDates.read(words, 0, words.size());
    if (read.isPresent() && read.get().kind() == Kind.DATE) {
      return read.get().text();
    }
    if (read.isPresent() && read.get().kind() == Kind.MONTH_DAY) {
      throw Suggestions.noYear(read.get().text());
    }
    return IsoText.date(value).toString(); // the error of version 1's reading
  }

  /** A date, or a month and day without a year ({@code --12-25}, {@code December 25}). */
  static String dateOrMonthDay(String value) throws ToolException {
    String s = value.strip();
    if (s.length() == 7 && s.startsWith("--") && s.charAt(4) == '-') {
      return monthDay(s);
    }
    List<String> words = Phrases.words(value);
    Optional<Written> read = WrittenDates.read(words, 0, words.size());
    if (read.isPresent() && read.get().kind() == Kind.MONTH_DAY) {
      return read.get().text();
    }
    return date(value);
  }

  private static String monthDay(String s) throws ToolException {
    if (!WrittenDates.isDigits(s.substring(2, 4)) || !WrittenDates.isDigits(s.substring(5, 7))) {
      throw Problems.invalidDate("expected a month and day --MM-DD such as --12-25 but found " + Problems.quoteV2(s));
    }
    int month = Integer.parseInt(s.substring(2, 4));
    int day = Integer.parseInt(s.substring(5, 7));
    if (month < 1 || month > 12 || day < 1 || day > java.time.Month.of(month).maxLength()) {
      throw Problems.invalidDate(Problems.quoteV2(s) + " is not a day of the year");
    }
    return s;
  }

  /** start_of and end_of: a date, a year-month ({@code 2024-02}) or a year ({@code 2024}). */
  private static String periodDate(String value) throws ToolException {
    List<String> words = Phrases.words(value);
    Optional<Written> read = WrittenDates.read(words, 0, words.size());
    if (read.isPresent() && (read.get().kind() == Kind.YEAR_MONTH || read.get().kind() == Kind.YEAR)) {
      return read.get().text();
    }
    return date(value);
  }

  /** nth_weekday: the month, from a year-month or a date. */
  private static String monthOf(String value) throws ToolException {
    List<String> words = Phrases.words(value);
    Optional<Written> read = WrittenDates.read(words, 0, words.size());
    if (read.isPresent() && read.get().kind() == Kind.YEAR_MONTH) {
      return read.get().text();
    }
    if (read.isPresent() && read.get().kind() == Kind.DATE) {
      return read.get().text().substring(0, read.get().text().length() - 3);
    }
    return IsoText.yearMonthOf(value).toString();
  }

  static String weekday(String value) throws ToolException {
    Optional<DayOfWeek> day = WrittenDates.weekday(value.strip().toLowerCase(Locale.ROOT));
    if (day.isEmpty()) {
      throw Problems.invalidArgument("weekday must be a day's English name, monday to sunday, but was " + Problems.quoteV2(value));
    }
    return day.get().name().toLowerCase(Locale.ROOT);
  }

  private static String oneOf(String name, String value, List<String> allowed) throws ToolException {
    String v = value.strip().toLowerCase(Locale.ROOT);
    if (!allowed.contains(v)) {
      throw Problems.invalidArgument(name + " must be one of " + String.join(", ", allowed) + " but was " + Problems.quoteV2(value));
    }
    return v;
  }

  /** The reference time as version 1 keeps it: the zone (a city read into its id) and as_of in canonical form. */
  private static Arguments referenceTime(Arguments in, Arguments out) throws ToolException {
    if (in.has(CanonicalForm.ZONE)) {
      out = out.with(CanonicalForm.ZONE, ZoneNames.canonical(in.requireString(CanonicalForm.ZONE)));
    }
    Optional<String> asOf = in.string(CanonicalForm.AS_OF);
    if (asOf.isEmpty()) {
      return out;
    }
    String value = written(asOf.get(), Op.DateKind.STAMP);
    IsoStamp stamp = IsoText.stamp(value);
    if (stamp.zone().isPresent()) {
      throw Problems.invalidDate("as_of takes no bracketed zone; give the zone in 'zone' instead of " + Problems.quoteV2(asOf.get()));
    }
    return out.with(CanonicalForm.AS_OF, stamp.withoutZone());
  }

  /** {@code style} is long when asked, or when a locale is given without a style; long needs a locale. */
  private static Arguments wording(Arguments in, Arguments out) throws ToolException {
    Optional<String> locale = in.string(CanonicalForm.LOCALE);
    String canonicalLocale = locale.isPresent() ? Locales.canonical(locale.get()) : null;
    String style = in.string(CanonicalForm.STYLE).orElse(locale.isPresent() ? CanonicalForm.LONG : CanonicalForm.ISO);
    if (!style.equals(CanonicalForm.ISO) && !style.equals(CanonicalForm.LONG)) {
      throw Problems.invalidArgument("style must be iso or long but was " + Problems.quoteV2(style));
    }
    out = out.with(CanonicalForm.STYLE, style);
    if (style.equals(CanonicalForm.LONG)) {
      out = out.with(CanonicalForm.LOCALE, canonicalLocale != null ? canonicalLocale : Locales.DEFAULT_TAG);
    }
    return out;
  }
}
