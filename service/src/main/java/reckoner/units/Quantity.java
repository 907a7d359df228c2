package reckoner.units;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolException;

/**
 * A quantity as {@code units@2} reads it: one or more parts, each an exact amount and a unit as
 * written, largest first: {@code 3 cups}, {@code 5 ft 11 in}, {@code 2 lb 3 oz},
 * {@code 1 hour and 30 minutes}, {@code 5′11″}. A number after a unit starts the next part
 * (so {@code 5 ft 11 in} is 5 ft + 11 in, never 55 ft·in), except after an operator
 * ({@code L/100 km}, {@code miles per 100 km}); {@code and}, {@code &}, {@code +} and a comma may
 * join the parts. A sign belongs to the whole quantity and is written before the first part.
 * Immutable.
 */
record Quantity(List<Part> parts) {
  /** One part: an exact amount and its unit as written (cleaned). */
  record Part(Rational value, String unit) {
    Part {
      Objects.requireNonNull(value, "value");
      Objects.requireNonNull(unit, "unit");
    }
  }

  /** Says whether a unit expression reads (its words are known, ambiguity aside). */
  @FunctionalInterface
  interface UnitProbe {
    boolean readable(String unit);
  }

  private static final Set<String> OPERATOR_WORDS = Set.of("per", "square", "sq", "cubic", "cu");
  private static final Set<String> CONNECTORS = Set.of("and", "&", "+", ",");

  Quantity {
    parts = List.copyOf(parts);
    if (parts.isEmpty()) {
      throw new IllegalArgumentException("a quantity has at least one part");
    }
  }

  static Quantity of(Rational value, String unit) {
    return new Quantity(List.of(new Part(value, unit)));
  }

  boolean isSimple() {
    return parts.size() == 1;
  }

  List<String> units() {
    return parts.stream().map(Part::unit).toList();
  }

  /** The canonical text: each part as {@code AMOUNT UNIT}, joined by spaces ({@code 5 ft 11 in}). */
  String canonical() {
    StringBuilder sb = new StringBuilder();
    for (Part p : parts) {
      if (sb.length() > 0) {
        sb.append(' ');
      }
      sb.append(Amounts.text(p.value)).append(' ').append(p.unit);
    }
    return sb.toString();
  }

  /** Reads a whole quantity string ({@code 5 ft 11 in}); it starts with an amount. */
  static Quantity parse(String text, UnitTable table, UnitProbe probe) throws ToolException {
    String s = UnitText.prepare(text);
    Amounts.Amount first = s.isEmpty() ? null : Amounts.read(s, 0);
    if (first == null) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "a quantity starts with a number, as in '3 cups' or '5 ft 11 in',"
          + " but '" + clip(s) + "' does not");
    }
    return parse(first.value(), s.substring(first.end()), table, probe);
  }

  /** Reads the units after a first amount: {@code ft 11 in} after {@code 5}. {@code rest} is prepared text. */
  static Quantity parse(Rational firstValue, String rest, UnitTable table, UnitProbe probe) throws ToolException {
    List<Part> parts = new ArrayList<>();
    Rational value = firstValue;
    int unitStart = 0;
    while (true) {
      int boundary = nextPart(rest, unitStart);
      String unitText = stripConnectors(rest.substring(unitStart, boundary < 0 ? rest.length() : boundary));
      if (unitText.isEmpty()) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "the amount " + Amounts.text(value.signum() < 0 ? value.negate()
            : value) + " has no unit" + (parts.isEmpty() ? "" : " after '" + clip(parts.get(parts.size() - 1).unit) + "'")
            + "; give each part its unit, as in '5 ft 11 in'");
      }
      if (boundary < 0 && addCompact(parts, value, unitText, table, probe)) {
        break;
      }
      unitText = withoutSubstance(unitText, table, probe);
      parts.add(new Part(value, unit(unitText, table)));
      if (boundary < 0) {
        break;
      }
      if (parts.size() >= Resolver.MAX_PARTS) {
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a quantity may have at most " + Resolver.MAX_PARTS + " parts");
      }
      Amounts.Amount next = Amounts.read(rest, boundary);
      value = next.value();
      unitStart = next.end();
    }
    return new Quantity(parts);
  }

  /** A unit as kept: cleaned, and {@code /min} after a number read as {@code 1/min}. */
  private static String unit(String text, UnitTable table) {
    String u = UnitText.cleanUnit(text, table);
    return u.startsWith("/") ? "1" + u : u;
  }

  /**
   * {@code cup of flour} as {@code cup}: the substance does not change a volume, and where the
   * target is a mass the conversion is refused as a dimension mismatch that names the density.
   * Names that hold {@code of} ({@code barrel of oil}, {@code inch of mercury}) read whole first.
   */
  private static String withoutSubstance(String unitText, UnitTable table, UnitProbe probe) {
    int of = unitText.toLowerCase(Locale.ROOT).indexOf(" of ");
    if (of <= 0 || probe.readable(unit(unitText, table))) {
      return unitText;
    }
    String head = unitText.substring(0, of);
    return probe.readable(unit(head, table)) ? head : unitText;
  }

  /** {@code 5ft11in}: a last unit glued to the next part's amount, split where the whole does not read. */
  private static boolean addCompact(List<Part> parts, Rational value, String unitText, UnitTable table, UnitProbe probe)
      throws ToolException {
    int digit = 0;
    while (digit < unitText.length() && Character.isLetter(unitText.charAt(digit))) {
      digit++;
    }
    if (digit == 0 || digit == unitText.length() || !isDigit(unitText.charAt(digit)) || unitText.indexOf(' ') >= 0
        || probe.readable(unit(unitText, table)) || !probe.readable(unitText.substring(0, digit))) {
      return false;
    }
    Quantity rest;
    try {
      Amounts.Amount next = Amounts.read(unitText, digit);
      if (next == null) {
        return false;
      }
      rest = parse(next.value(), unitText.substring(next.end()), table, probe);
    } catch (ToolException e) {
      return false;
    }
    parts.add(new Part(value, unit(unitText.substring(0, digit), table)));
    parts.addAll(rest.parts);
    return true;
  }

  /** Where the next part's amount starts, at or after {@code from}; -1 when no other part follows. */
  private static int nextPart(String s, int from) {
    for (int j = Math.max(from, 1); j < s.length(); j++) {
      char c = s.charAt(j);
      if (!(isDigit(c) || (c == '.' && j + 1 < s.length() && isDigit(s.charAt(j + 1))))) {
        continue;
      }
      char prev = s.charAt(j - 1);
      if ((prev == '′' || prev == '″' || prev == '°') && j - 1 >= from) {
        return j; // 5′11″, 30°15′
      }
      if (prev != ' ') {
        continue;
      }
      String before = s.substring(from, j).trim();
      if (before.isEmpty()) {
        continue;
      }
      char last = before.charAt(before.length() - 1);
      if ("/*·×⋅∙^(-−÷".indexOf(last) >= 0) {
        continue;
      }
      int space = before.lastIndexOf(' ');
      String lastWord = before.substring(space + 1).toLowerCase(Locale.ROOT);
      if (OPERATOR_WORDS.contains(lastWord)) {
        continue;
      }
      return j;
    }
    return -1;
  }

  private static String stripConnectors(String unit) {
    String u = unit.trim();
    boolean changed = true;
    while (changed && !u.isEmpty()) {
      changed = false;
      if (u.endsWith(",") || u.endsWith("+") || u.endsWith("&")) {
        u = u.substring(0, u.length() - 1).trim();
        changed = true;
      }
      int space = u.lastIndexOf(' ');
      if (space > 0 && CONNECTORS.contains(u.substring(space + 1).toLowerCase(Locale.ROOT))) {
        u = u.substring(0, space).trim();
        changed = true;
      }
    }
    return u;
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }
}
