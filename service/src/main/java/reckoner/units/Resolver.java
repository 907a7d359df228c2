package reckoner.units;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * Reads the units of one {@code units@2} call together: the parts of the quantity ({@code ft} and
 * {@code in} of {@code 5 ft 11 in}) and the parts of the target ({@code ft+in}). Each unit is read
 * alone first; where that fails or the two sides do not convert, each is read again knowing the
 * dimension of the other side (which settles {@code pt}, {@code kt}, the prime marks, a bare
 * {@code C} or {@code F}, and a case slip such as {@code MG} beside {@code g}). Then the parts are
 * checked: a quantity's parts share a dimension and convert into each other by a rational factor;
 * a target's parts share the dimension, largest first, each a whole multiple of the next. Pure
 * function of its inputs; thread-safe.
 */
final class Resolver {
  static final int MAX_PARTS = 6;

  /** The dimensions between which a reciprocal conversion is made (as {@link Converter} does). */
  private static final Set<Dimension> RECIPROCAL = Set.of(
      Dimension.parse("L2"), Dimension.parse("L-2"), Dimension.parse("L-1 T"), Dimension.parse("L T-1"));

  private final UnitTable table;
  private final Map<String, List<SystemReadings.Spelling>> caseIndex;

  Resolver(UnitTable table) {
    this.table = table;
    this.caseIndex = SystemReadings.caseIndex(table);
  }

  Map<String, List<SystemReadings.Spelling>> caseIndex() {
    return caseIndex;
  }

  /** Whether a value in {@code a} converts to {@code b} as a reciprocal (fuel economy, pace). */
  static boolean reciprocal(Dimension a, Dimension b) {
    return b != null && a.times(b).isNone() && RECIPROCAL.contains(a);
  }

  /**
   * The units of a call, read and checked, with the readings taken.
   *
   * @param system the system whose default readings apply ({@code us}, {@code imperial}, {@code metric})
   * @param from the units of the quantity's parts, largest first (one for a simple quantity)
   * @param to the units of the target's parts, largest first (one for a simple target)
   */
  Resolution resolve(String system, List<String> from, List<String> to) throws ToolException {
    int n = from.size();
    List<String> all = new ArrayList<>(from);
    all.addAll(to);
    Unit[] units = new Unit[all.size()];
    ToolException[] errors = new ToolException[all.size()];
    List<List<String>> notes = new ArrayList<>();
    boolean retry = false;
    for (int i = 0; i < all.size(); i++) {
      notes.add(List.of());
      try {
        SystemReadings readings = new SystemReadings(table, caseIndex, system, null);
        units[i] = UnitParser.parse(all.get(i), table, readings);
        notes.set(i, readings.notes());
      } catch (ToolException e) {
        errors[i] = e;
        retry = true;
      }
    }
    Dimension fromDim = firstDimension(units, 0, n);
    Dimension toDim = firstDimension(units, n, all.size());
    boolean letters = n == 1 && to.size() == 1 && isTemperatureLetter(from.get(0)) && isTemperatureLetter(to.get(0));
    if (fromDim != null && toDim != null && !fromDim.equals(toDim) && !reciprocal(fromDim, toDim)) {
      retry = true;
    }
    if (retry) {
      for (int i = 0; i < all.size(); i++) {
        boolean source = i < n;
        Dimension hint = letters ? SystemReadings.TEMPERATURE
            : source ? (toDim != null ? toDim : firstDimensionExcept(units, 0, n, i))
            : (fromDim != null ? fromDim : firstDimensionExcept(units, n, all.size(), i));
        if (hint == null) {
          continue;
        }
        try {
          SystemReadings readings = new SystemReadings(table, caseIndex, system, hint);
          units[i] = UnitParser.parse(all.get(i), table, readings);
          notes.set(i, readings.notes());
          errors[i] = null;
        } catch (ToolException e) {
          errors[i] = e;
        }
      }
    }
    for (ToolException e : errors) {
      if (e != null) {
        throw e;
      }
    }
    List<Unit> fromUnits = List.of(units).subList(0, n);
    List<Unit> toUnits = List.of(units).subList(n, units.length);
    checkQuantity(from, fromUnits);
    checkTarget(to, toUnits);
    Unit a = fromUnits.get(n - 1);
    Unit b = toUnits.get(to.size() - 1);
    if ((a.hasOffset() && b.interval()) || (a.interval() && b.hasOffset())) {
      throw new ToolException(ErrorCode.DIMENSION_MISMATCH, "a temperature on a scale ('" + clip(from.get(n - 1))
          + "') and a temperature difference ('" + clip(to.get(to.size() - 1)) + "') do not convert into each other;"
          + " convert differences with K, Δ°C or Δ°F on both sides");
    }
    // A dry run with the value 1: the dimensions convert, or the error names them.
    Converter.convert(Rational.ONE, fromUnits.get(n - 1), from.get(n - 1), toUnits.get(to.size() - 1),
        to.get(to.size() - 1));
    if (to.size() > 1 && !fromUnits.get(0).dimension().equals(toUnits.get(0).dimension())) {
      throw new ToolException(ErrorCode.DIMENSION_MISMATCH, "a target in parts ('" + clip(String.join("+", to))
          + "') takes the dimension of the quantity; convert to one unit for a reciprocal");
    }
    Set<String> joined = new LinkedHashSet<>();
    notes.forEach(joined::addAll);
    return new Resolution(List.copyOf(fromUnits), List.copyOf(toUnits), List.copyOf(to),
        joined.isEmpty() ? null : String.join("; ", joined));
  }

  /** Whether an expression is a bare C or F (either case), which beside a temperature reads as °C or °F. */
  static boolean isTemperatureLetter(String unit) {
    return unit.equalsIgnoreCase("C") || unit.equalsIgnoreCase("F");
  }

  private static Dimension firstDimension(Unit[] units, int from, int to) {
    for (int i = from; i < to; i++) {
      if (units[i] != null) {
        return units[i].dimension();
      }
    }
    return null;
  }

  private static Dimension firstDimensionExcept(Unit[] units, int from, int to, int except) {
    for (int i = from; i < to; i++) {
      if (i != except && units[i] != null) {
        return units[i].dimension();
      }
    }
    return null;
  }

  private static void checkQuantity(List<String> written, List<Unit> units) throws ToolException {
    if (units.size() == 1) {
      return;
    }
    Unit last = units.get(units.size() - 1);
    for (int i = 0; i < units.size(); i++) {
      Unit u = units.get(i);
      if (u.hasOffset() || u.interval()) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "a temperature cannot be given in parts ('"
            + clip(written.get(i)) + "'); give it as one value");
      }
      if (!u.dimension().equals(last.dimension())) {
        throw new ToolException(ErrorCode.DIMENSION_MISMATCH, "the parts of a quantity must measure one kind: '"
            + clip(written.get(i)) + "' is " + DimensionNames.describe(u.dimension()) + " but '"
            + clip(written.get(units.size() - 1)) + "' is " + DimensionNames.describe(last.dimension()));
      }
      if (!u.factor().divide(last.factor()).isRational()) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "'" + clip(written.get(i)) + "' and '"
            + clip(written.get(units.size() - 1)) + "' have no rational ratio; give the quantity in one unit");
      }
    }
  }

  private static void checkTarget(List<String> written, List<Unit> units) throws ToolException {
    if (units.size() == 1) {
      return;
    }
    for (int i = 0; i < units.size(); i++) {
      Unit u = units.get(i);
      if (u.hasOffset() || u.interval()) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "a temperature cannot be split into parts ('"
            + clip(written.get(i)) + "')");
      }
      if (i + 1 < units.size()) {
        Unit next = units.get(i + 1);
        if (!u.dimension().equals(next.dimension())) {
          throw new ToolException(ErrorCode.DIMENSION_MISMATCH, "the parts of a target must measure one kind: '"
              + clip(written.get(i)) + "' is " + DimensionNames.describe(u.dimension()) + " but '"
              + clip(written.get(i + 1)) + "' is " + DimensionNames.describe(next.dimension()));
        }
        Factor ratio = u.factor().divide(next.factor());
        if (!ratio.isRational() || !ratio.coefficient().denominator().equals(BigInteger.ONE)
            || ratio.coefficient().numerator().compareTo(BigInteger.ONE) <= 0) {
          throw new ToolException(new ToolError(ErrorCode.SYNTAX_ERROR, "in a target in parts each unit is a whole"
              + " multiple of the next, largest first, as in ft+in or h+min+s; '" + clip(written.get(i)) + "' is not a"
              + " whole multiple of '" + clip(written.get(i + 1)) + "'", List.of()));
        }
      }
    }
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }

  /**
   * The units of a call, read: the quantity's parts, the target's parts as read and as written,
   * and the readings taken (null when every word was read as written).
   */
  record Resolution(List<Unit> from, List<Unit> to, List<String> toWritten, String note) {}
}
