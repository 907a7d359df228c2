package reckoner.data;

import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * One non-blank line of a data file: a JSON object, its members in file order. Member values are
 * {@link String}, {@link Boolean}, {@link BigDecimal}, {@link List}, {@link Map} (in member order)
 * or {@link #NULL}; an absent member is {@code null}. Immutable once read.
 *
 * @param file the file's name, as reports show it
 * @param number the line's number in the file, from 1
 * @param members the object's members
 */
public record DataLine(String file, int number, Map<String, Object> members) {
  /** The JSON {@code null} value (an absent member is Java {@code null}). */
  public static final Object NULL = new Object() {
    @Override
    public String toString() {
      return "null";
    }
  };

  public DataLine {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(members, "members");
  }

  /** A member's value, or {@code null} when absent. */
  public Object get(String member) {
    return members.get(member);
  }

  /** Why a line cannot be loaded; thrown by a format's reader and reported with the file and line. */
  public static final class Problem extends Exception {
    private static final long serialVersionUID = 1L;

    public Problem(String reason) {
      super(reason, null, false, false);
    }
  }

  /**
   * A member value as an error message shows it: a string quoted and {@linkplain DataText#echo
   * echoed}, {@code an object}, {@code an array}, or the literal ({@code 3}, {@code true}, {@code null}).
   */
  public static String describe(Object value) {
    if (value instanceof String s) {
      return "\"" + DataText.echo(s) + "\"";
    }
    if (value instanceof Map) {
      return "an object";
    }
    if (value instanceof List) {
      return "an array";
    }
    if (value instanceof BigDecimal d) {
      return d.toString();
    }
    return String.valueOf(value);
  }
}
