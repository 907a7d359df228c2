package reckoner.dates;

import com.ibm.icu.util.ULocale;
import java.math.BigDecimal;
import java.time.DayOfWeek;
import java.time.Instant;
import java.time.LocalDate;
import java.time.MonthDay;
import java.time.Year;
import java.time.YearMonth;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.time.temporal.IsoFields;
import java.util.Locale;
import java.util.Optional;
import reckoner.dates.CanonicalFormV2.NewOp;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.DecimalText;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Computes the answers of version 2's new ops, and of {@code between} with a holiday region; the
 * other ops are answered by version 1's {@link Answers}. The reference time is read as version 1
 * reads it ({@code as_of}, else the clock once, then the answer is not cached). Conventions, also
 * stated in the spec: next WEEKDAY is the first such day after the reference date, last WEEKDAY the
 * latest before it, this WEEKDAY the first on or after it; weeks run Monday to Sunday (ISO 8601);
 * business days are Monday to Friday less the region's holidays, counted after the start date.
 * Pure functions; thread-safe.
 */
final class AnswersV2 {
  private AnswersV2() {}

  static Answer of(Arguments canonical, CallContext context) throws ToolException {
    String opName = canonical.requireString(CanonicalForm.OP);
    Optional<NewOp> op = NewOp.of(opName);
    if (op.isEmpty()) {
      if (canonical.has(CanonicalFormV2.REGION)) {
        return withHolidays(Answer.of(number(businessDays(IsoText.date(canonical.requireString(CanonicalForm.DATE)),
            IsoText.date(canonical.requireString(CanonicalForm.TO)), canonical.requireString(CanonicalFormV2.REGION)))), canonical);
      }
      try {
        return Answers.of(canonical, context);
      } catch (ToolException e) {
        // Version 1 calls the one uncomputable call it finds at answer time invalid_argument; here it is invalid_date (422).
        if (e.error().code() == ErrorCode.INVALID_ARGUMENT) {
          throw Problems.invalidDate(e.error().detail());
        }
        throw e;
      }
    }
    Optional<ULocale> words = canonical.string(CanonicalForm.STYLE).filter(CanonicalForm.LONG::equals).isPresent()
        ? Optional.of(Locales.of(canonical.requireString(CanonicalForm.LOCALE)))
        : Optional.empty();
    Instant[] clockRead = new Instant[1];
    Moment reference = op.get().readsReferenceTime(canonical) ? reference(canonical, context, clockRead) : null;
    String text = switch (op.get()) {
      case NOW -> now(reference, canonical, words);
      case FROM_NOW -> fromNow(reference, canonical, words);
      case RELATIVE_WEEKDAY -> dateText(relativeWeekday(reference.date(), canonical), words);
      case UNTIL -> number(span(reference.date(), dateOrNext(canonical.requireString(CanonicalForm.TO), reference.date(), true), canonical));
      case SINCE -> number(span(dateOrNext(canonical.requireString(CanonicalForm.DATE), reference.date(), false), reference.date(), canonical));
      case START_OF, END_OF -> dateText(periodEdge(op.get() == NewOp.END_OF, base(canonical, reference), canonical), words);
      case NTH_WEEKDAY -> dateText(nthWeekday(canonical, reference), words);
      case ADD_BUSINESS_DAYS -> dateText(addBusinessDays(base(canonical, reference), canonical.requireNumber(CanonicalFormV2.DAYS).longValueExact(),
          canonical.string(CanonicalFormV2.REGION).orElse(null)), words);
      case IS_BUSINESS_DAY -> Holidays.isBusinessDay(canonical.string(CanonicalFormV2.REGION).orElse(null), base(canonical, reference)) ? "yes" : "no";
      case IS_HOLIDAY -> Holidays.isHoliday(canonical.requireString(CanonicalFormV2.REGION), base(canonical, reference)) ? "yes" : "no";
    };
    Answer answer = clockRead[0] == null ? Answer.of(text) : Answer.fromClock(text, clockRead[0]);
    return withHolidays(answer, canonical);
  }

  /** The answer naming the holiday data it used, when the call names a region. */
  private static Answer withHolidays(Answer answer, Arguments canonical) {
    return canonical.has(CanonicalFormV2.REGION) ? answer.withDataVersion(Holidays.DATA_VERSION) : answer;
  }

  /* ------------------------------------------------ the reference time ------------------------------------------------ */

  /** The reference moment, as version 1's today and ago read it; the clock read, if it was, goes to {@code clockRead[0]}. */
  private static Moment reference(Arguments canonical, CallContext context, Instant[] clockRead) throws ToolException {
    Optional<ZoneId> zone = canonical.has(CanonicalForm.ZONE)
        ? Optional.of(Zones.of(canonical.requireString(CanonicalForm.ZONE)))
        : Optional.empty();
    Optional<String> asOf = canonical.string(CanonicalForm.AS_OF);
    Moment reference;
    if (asOf.isPresent()) {
      IsoStamp stamp = IsoText.stamp(asOf.get());
      reference = stamp.offset().isPresent() && zone.isPresent()
          ? Moment.of(stamp, Optional.empty()).in(zone.get())
          : Moment.of(stamp, zone);
    } else {
      clockRead[0] = context.clock().instant(); // read once
      reference = Moment.of(ZonedDateTime.ofInstant(clockRead[0], zone.orElse(ZoneOffset.UTC)));
    }
    IsoText.checked(reference.date());
    return reference;
  }

  private static LocalDate base(Arguments canonical, Moment reference) throws ToolException {
    if (canonical.has(CanonicalForm.DATE)) {
      String date = canonical.requireString(CanonicalForm.DATE);
      String unsigned = date.startsWith("-") || date.startsWith("+") ? date.substring(1) : date;
      int dashes = (int) unsigned.chars().filter(c -> c == '-').count();
      if (dashes == 0) { // a year, of start_of and end_of
        return LocalDate.of(IsoText.yearOf(date), 1, 1);
      }
      if (dashes == 1) { // a year-month
        return IsoText.yearMonthOf(date).atDay(1);
      }
      return IsoText.date(date);
    }
    return reference.date();
  }

  /* ------------------------------------------------ the ops ------------------------------------------------ */

  private static String now(Moment reference, Arguments canonical, Optional<ULocale> words) throws ToolException {
    if (!reference.hasTime()) {
      throw Problems.invalidDate("as_of " + canonical.string(CanonicalForm.AS_OF).orElse("") + " is a date without a time of day,"
          + " so the time now cannot be told; give as_of as a date-time such as 2024-06-12T09:30Z");
    }
    return words.isPresent() ? reference.words(words.get()) : reference.isoText();
  }

  private static String fromNow(Moment reference, Arguments canonical, Optional<ULocale> words) throws ToolException {
    IsoDuration ahead = IsoDuration.parse(canonical.requireString(CanonicalForm.DURATION));
    if (ahead.hasTime()) {
      if (!reference.hasTime()) {
        throw Problems.invalidDate("as_of " + canonical.string(CanonicalForm.AS_OF).orElse("") + " is a date without a time of day, so "
            + ahead + " from now cannot be told; give as_of as a date-time");
      }
      Moment then = reference.plus(ahead);
      return words.isPresent() ? then.words(words.get()) : then.isoText();
    }
    return dateText(Moment.of(reference.date()).plus(ahead).date(), words);
  }

  /** next: the first such weekday after the date; last: the latest before it; this: the first on or after it. */
  static LocalDate relativeWeekday(LocalDate date, Arguments canonical) throws ToolException {
    DayOfWeek target = DayOfWeek.valueOf(canonical.requireString(CanonicalFormV2.WEEKDAY).toUpperCase(Locale.ROOT));
    int ahead = Math.floorMod(target.getValue() - date.getDayOfWeek().getValue(), 7);
    int back = Math.floorMod(date.getDayOfWeek().getValue() - target.getValue(), 7);
    LocalDate result = switch (canonical.requireString(CanonicalFormV2.WHICH)) {
      case "next" -> date.plusDays(ahead == 0 ? 7 : ahead);
      case "last" -> date.minusDays(back == 0 ? 7 : back);
      default -> date.plusDays(ahead);
    };
    return IsoText.checked(result);
  }

  /** A date, or the occurrence of a month and day nearest the reference date: on or after it, or on or before it. */
  private static LocalDate dateOrNext(String text, LocalDate reference, boolean forward) throws ToolException {
    if (!text.startsWith("--")) {
      return IsoText.date(text);
    }
    MonthDay day = MonthDay.of(Integer.parseInt(text.substring(2, 4)), Integer.parseInt(text.substring(5, 7)));
    int year = reference.getYear();
    for (int i = 0; i < 9; i++) { // February 29 may be up to eight years away
      int y = forward ? year + i : year - i;
      if (day.isValidYear(y)) {
        LocalDate candidate = day.atYear(y);
        if (forward ? !candidate.isBefore(reference) : !candidate.isAfter(reference)) {
          return IsoText.checked(candidate);
        }
      }
    }
    throw Problems.outOfRange(text + " does not occur near " + reference);
  }

  private static long span(LocalDate from, LocalDate to, Arguments canonical) throws ToolException {
    Spans.Unit unit = Spans.Unit.of(canonical.requireString(CanonicalForm.UNIT));
    Optional<String> region = canonical.string(CanonicalFormV2.REGION);
    if (region.isPresent()) {
      return businessDays(from, to, region.get());
    }
    return Spans.between(from, to, unit);
  }

  static LocalDate periodEdge(boolean end, LocalDate base, Arguments canonical) throws ToolException {
    long shift = canonical.requireNumber(CanonicalFormV2.SHIFT).longValueExact();
    try {
      LocalDate result = switch (canonical.requireString(CanonicalFormV2.PERIOD)) {
        case "week" -> {
          LocalDate monday = base.minusDays(base.getDayOfWeek().getValue() - 1L).plusWeeks(shift);
          yield end ? monday.plusDays(6) : monday;
        }
        case "month" -> {
          YearMonth month = YearMonth.from(base).plusMonths(shift);
          yield end ? month.atEndOfMonth() : month.atDay(1);
        }
        case "quarter" -> {
          YearMonth first = YearMonth.of(base.getYear(), (base.get(IsoFields.QUARTER_OF_YEAR) - 1) * 3 + 1).plusMonths(3 * shift);
          yield end ? first.plusMonths(2).atEndOfMonth() : first.atDay(1);
        }
        default -> {
          Year year = Year.of(base.getYear()).plusYears(shift);
          yield end ? year.atMonth(12).atEndOfMonth() : year.atDay(1);
        }
      };
      return IsoText.checked(result);
    } catch (java.time.DateTimeException | ArithmeticException e) {
      throw Problems.outOfRange("the period falls outside the supported years " + IsoText.MIN_YEAR + " to " + IsoText.MAX_YEAR);
    }
  }

  private static LocalDate nthWeekday(Arguments canonical, Moment reference) throws ToolException {
    YearMonth month = canonical.has(CanonicalForm.DATE)
        ? IsoText.yearMonthOf(canonical.requireString(CanonicalForm.DATE))
        : YearMonth.from(reference.date());
    long shift = canonical.requireNumber(CanonicalFormV2.SHIFT).longValueExact();
    try {
      month = month.plusMonths(shift);
    } catch (java.time.DateTimeException e) {
      throw Problems.outOfRange("the month falls outside the supported years");
    }
    IsoText.checked(month.atDay(1));
    DayOfWeek day = DayOfWeek.valueOf(canonical.requireString(CanonicalFormV2.WEEKDAY).toUpperCase(Locale.ROOT));
    int n = canonical.requireNumber(CanonicalFormV2.N).intValueExact();
    if (n == -1) {
      LocalDate last = month.atEndOfMonth();
      return last.minusDays(Math.floorMod(last.getDayOfWeek().getValue() - day.getValue(), 7));
    }
    LocalDate first = month.atDay(1);
    LocalDate result = first.plusDays(Math.floorMod(day.getValue() - first.getDayOfWeek().getValue(), 7)).plusWeeks(n - 1L);
    if (!YearMonth.from(result).equals(month)) {
      throw Problems.invalidDate(IsoText.monthName(month.getMonth()) + " " + IsoText.yearText(month.getYear()) + " has only 4 "
          + IsoText.weekdayName(day) + "s");
    }
    return result;
  }

  /**
   * The business day {@code days} business days after {@code start} (before it when negative), the
   * start itself not counted; zero gives the start when it is a business day, else the next one.
   */
  static LocalDate addBusinessDays(LocalDate start, long days, String region) throws ToolException {
    if (region != null && Math.abs(days) > CanonicalFormV2.MAX_REGION_BUSINESS_DAYS) {
      throw Problems.outOfRange("with holidays at most " + CanonicalFormV2.MAX_REGION_BUSINESS_DAYS + " business days can be added, not "
          + days);
    }
    LocalDate d = start;
    if (days == 0) {
      while (!Holidays.isBusinessDay(region, d)) {
        d = IsoText.checked(d.plusDays(1));
      }
      return d;
    }
    long remaining = Math.abs(days);
    int step = days > 0 ? 1 : -1;
    try {
      if (region == null && remaining > 5) { // any seven days in a row hold five weekdays
        long weeks = (remaining - 1) / 5;
        d = IsoText.checked(d.plusWeeks(step * weeks));
        remaining -= weeks * 5;
      }
      while (remaining > 0) {
        d = d.plusDays(step);
        if (d.getYear() < IsoText.MIN_YEAR || d.getYear() > IsoText.MAX_YEAR) {
          IsoText.checked(d);
        }
        if (Holidays.isBusinessDay(region, d)) {
          remaining--;
        }
      }
    } catch (java.time.DateTimeException | ArithmeticException e) {
      throw Problems.outOfRange("the result falls outside the supported years " + IsoText.MIN_YEAR + " to " + IsoText.MAX_YEAR);
    }
    return d;
  }

  /** Business days {@code d} with {@code from < d <= to}, less the region's holidays; negated when {@code to} is earlier. */
  static long businessDays(LocalDate from, LocalDate to, String region) throws ToolException {
    if (to.isBefore(from)) {
      return -businessDays(to, from, region);
    }
    if (Spans.days(from, to) > CanonicalFormV2.MAX_REGION_BUSINESS_DAYS * 7 / 5) {
      throw Problems.outOfRange("with holidays business days are counted over at most " + CanonicalFormV2.MAX_REGION_BUSINESS_DAYS * 7 / 5
          + " days");
    }
    long count = 0;
    for (LocalDate d = from.plusDays(1); !d.isAfter(to); d = d.plusDays(1)) {
      if (Holidays.isBusinessDay(region, d)) {
        count++;
      }
    }
    return count;
  }

  private static String dateText(LocalDate date, Optional<ULocale> words) {
    return words.isPresent() ? Wording.date(date, words.get()) : date.toString();
  }

  private static String number(long value) {
    return DecimalText.format(BigDecimal.valueOf(value), false);
  }
}
