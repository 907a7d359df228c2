package reckoner.tool;

import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A tool's identity, such as {@code arith@1}. Immutable.
 *
 * <p>Names are lower-case ASCII words ({@code [a-z][a-z0-9_]*}, at most 32 characters); versions
 * are positive integers. A published version never changes its outputs.
 */
public record ToolId(String name, int version) implements Comparable<ToolId> {
  private static final Pattern NAME = Pattern.compile("[a-z][a-z0-9_]{0,31}");

  public ToolId {
    Objects.requireNonNull(name, "name");
    if (!NAME.matcher(name).matches()) {
      throw new IllegalArgumentException("tool name must match [a-z][a-z0-9_]{0,31}: " + name);
    }
    if (version < 1) {
      throw new IllegalArgumentException("version must be positive: " + version);
    }
  }

  public static ToolId of(String name, int version) {
    return new ToolId(name, version);
  }

  /** Parses {@code name@version}; throws {@link IllegalArgumentException} on any other form. */
  public static ToolId parse(CharSequence text) {
    String s = text.toString();
    int at = s.indexOf('@');
    if (at < 0) {
      throw new IllegalArgumentException("expected NAME@VERSION but was: " + s);
    }
    return new ToolId(s.substring(0, at), parseVersion(s.substring(at + 1)));
  }

  /** Parses a version number as written in a path or markup: digits only, no sign, no leading zero. */
  public static int parseVersion(String text) {
    if (text.isEmpty() || text.length() > 9 || text.charAt(0) == '0' || !text.chars().allMatch(c -> c >= '0' && c <= '9')) {
      throw new IllegalArgumentException("version must be a positive whole number: " + text);
    }
    return Integer.parseInt(text);
  }

  /** Whether {@code name} is a well-formed tool name. */
  public static boolean isValidName(String name) {
    return name != null && NAME.matcher(name).matches();
  }

  @Override
  public int compareTo(ToolId other) {
    int byName = name.compareTo(other.name);
    return byName != 0 ? byName : Integer.compare(version, other.version);
  }

  @Override
  public String toString() {
    return name + "@" + version;
  }
}
