package reckoner.dates;

import java.time.ZoneId;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import reckoner.tool.Arguments;
import reckoner.tool.ToolException;

/**
 * Turns structured arguments into the one canonical form of a call: values normalised (dates as
 * java.time writes them, durations without zero parts, zone ids and locale tags in their proper
 * case, calendar keys in BCP 47 form), defaults filled ({@code unit=days}, {@code style}), and
 * arguments the op ignores dropped ({@code as_of} outside today/ago; {@code style} and
 * {@code locale} where nothing is worded). Any other argument the op does not take is
 * invalid_argument. Pure functions; thread-safe.
 */
final class CanonicalForm {
  static final String OP = "op";
  static final String DATE = "date";
  static final String TO = "to";
  static final String DURATION = "duration";
  static final String UNIT = "unit";
  static final String ZONE = "zone";
  static final String CALENDAR = "calendar";
  static final String AS_OF = "as_of";
  static final String LOCALE = "locale";
  static final String STYLE = "style";
  static final String ISO = "iso";
  static final String LONG = "long";
  /** Accepted by every op, dropped where meaningless: they may come from a header or a caller's defaults. */
  private static final Set<String> EVERY_OP = Set.of(OP, AS_OF, STYLE, LOCALE);

  private CanonicalForm() {}

  static Arguments of(Arguments in) throws ToolException {
    Op op = Op.of(in.requireString(OP));
    for (String name : in.asMap().keySet()) {
      if (!EVERY_OP.contains(name) && !op.takes().contains(name)) {
        throw Problems.invalidArgument("op '" + op.wireName() + "' takes " + String.join(", ", new TreeSet<>(op.takes()))
            + "; '" + name + "' does not apply");
      }
    }
    for (String name : op.takes()) {
      if (!in.has(name) && required(op, name)) {
        throw Problems.invalidArgument("op '" + op.wireName() + "' needs '" + name + "'");
      }
    }
    Arguments out = Arguments.of(OP, op.wireName());
    out = date(op, in, out);
    if (op.toKind() == Op.ToKind.DATE) {
      out = out.with(TO, IsoText.date(in.requireString(TO)).toString());
    } else if (op.toKind() == Op.ToKind.ZONE) {
      out = out.with(TO, Zones.of(in.requireString(TO)).getId());
    }
    if (in.has(DURATION)) {
      out = out.with(DURATION, IsoDuration.parse(in.requireString(DURATION)).toString());
    }
    if (op == Op.BETWEEN) {
      out = out.with(UNIT, Spans.Unit.of(in.string(UNIT).orElse("days")).wireName());
    }
    if (in.has(CALENDAR)) {
      out = out.with(CALENDAR, CalendarSystem.of(in.requireString(CALENDAR)).key());
      if (op == Op.FROM_CALENDAR) { // the date's form depends on the calendar
        CalendarSystem calendar = CalendarSystem.of(in.requireString(CALENDAR));
        CalendarDate date = calendar.parse(in.requireString(DATE));
        calendar.toIso(date); // a day that does not exist fails here, not later
        out = out.with(DATE, date.toString());
      }
    }
    if (op.readsReferenceTime()) {
      out = referenceTime(in, out);
    }
    return wording(op, in, out);
  }

  private static boolean required(Op op, String name) {
    return switch (name) {
      case ZONE, UNIT -> false;
      default -> true;
    };
  }

  private static Arguments date(Op op, Arguments in, Arguments out) throws ToolException {
    switch (op.dateKind()) {
      case NONE, CALENDAR_DATE:
        return out;
      case DATE:
        return out.with(DATE, IsoText.date(in.requireString(DATE)).toString());
      case YEAR:
        return out.with(DATE, IsoText.yearText(IsoText.yearOf(in.requireString(DATE))));
      case YEAR_MONTH:
        return out.with(DATE, IsoText.yearMonthOf(in.requireString(DATE)).toString());
      default:
        return stamp(op, in, out);
    }
  }

  /** A date or date-time with its zone: from the {@code zone} argument or a bracket in the date. */
  private static Arguments stamp(Op op, Arguments in, Arguments out) throws ToolException {
    IsoStamp stamp = IsoText.stamp(in.requireString(DATE));
    Optional<ZoneId> zone = in.has(ZONE) ? Optional.of(Zones.of(in.requireString(ZONE))) : Optional.empty();
    if (stamp.zone().isPresent()) {
      ZoneId bracketed = Zones.of(stamp.zone().get());
      if (zone.isPresent() && !zone.get().equals(bracketed)) {
        throw Problems.invalidArgument("the date names the zone " + bracketed.getId() + " but zone is " + zone.get().getId());
      }
      zone = Optional.of(bracketed);
    }
    if (op.dateKind() == Op.DateKind.DATE_TIME) {
      if (!stamp.hasTime()) {
        throw Problems.invalidDate("op '" + op.wireName() + "' needs a date-time such as 2024-03-10T02:30 but found the date "
            + Problems.quote(in.requireString(DATE)));
      }
      if (zone.isEmpty() && stamp.offset().isEmpty()) {
        throw Problems.invalidArgument("op '" + op.wireName() + "' needs the zone the date-time is in: give zone, "
            + "e.g. America/New_York, or an offset in the date-time");
      }
    } else if (zone.isPresent() && !stamp.hasTime()) {
      throw Problems.invalidArgument("a zone applies only to a date-time; " + stamp.date() + " is a date");
    }
    Moment.of(stamp, zone); // an offset the zone does not use there fails here
    out = out.with(DATE, stamp.withoutZone());
    return zone.isPresent() ? out.with(ZONE, zone.get().getId()) : out;
  }

  private static Arguments referenceTime(Arguments in, Arguments out) throws ToolException {
    if (in.has(ZONE)) {
      out = out.with(ZONE, Zones.of(in.requireString(ZONE)).getId());
    }
    Optional<String> asOf = in.string(AS_OF);
    if (asOf.isEmpty()) {
      return out;
    }
    IsoStamp stamp = IsoText.stamp(asOf.get());
    if (stamp.zone().isPresent()) {
      throw Problems.invalidDate("as_of takes no bracketed zone; give the zone in 'zone' instead of "
          + Problems.quote(asOf.get()));
    }
    return out.with(AS_OF, stamp.withoutZone());
  }

  /** {@code style} is long when asked, or when a locale is given without a style; long needs a locale. */
  private static Arguments wording(Op op, Arguments in, Arguments out) throws ToolException {
    Optional<String> locale = in.string(LOCALE);
    String canonicalLocale = locale.isPresent() ? Locales.canonical(locale.get()) : null;
    if (!op.worded()) {
      return out;
    }
    String style = in.string(STYLE).orElse(locale.isPresent() ? LONG : ISO);
    if (!style.equals(ISO) && !style.equals(LONG)) {
      throw Problems.invalidArgument("style must be iso or long but was " + Problems.quote(style));
    }
    out = out.with(STYLE, style);
    if (style.equals(LONG)) {
      out = out.with(LOCALE, canonicalLocale != null ? canonicalLocale : Locales.DEFAULT_TAG);
    }
    return out;
  }
}
