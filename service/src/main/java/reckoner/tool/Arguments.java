package reckoner.tool;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeMap;

/**
 * The arguments of one call: a sorted map from argument name to a scalar value, which is a
 * {@link String}, a {@link Boolean} or a {@link BigDecimal} (every JSON number, normalised so that
 * {@code 2}, {@code 2.0} and {@code 2e0} are one value). Immutable; two spellings of one call give
 * equal instances, so {@code Arguments} is a sound cache key.
 */
public final class Arguments {
  /** The name of the free-text form that every tool accepts. */
  public static final String TEXT = "text";

  private static final Arguments EMPTY = new Arguments(new TreeMap<>());
  private final TreeMap<String, Object> values;
  private String canonicalJson; // computed once, racy but idempotent
  private int hash; // likewise; 0 = not yet computed

  private Arguments(TreeMap<String, Object> values) {
    this.values = values;
  }

  public static Arguments empty() {
    return EMPTY;
  }

  /** Returns arguments holding {@code values}; each value must be a String, Boolean or number. */
  public static Arguments of(Map<String, ?> values) {
    TreeMap<String, Object> copy = new TreeMap<>();
    values.forEach((k, v) -> copy.put(Objects.requireNonNull(k, "name"), normalise(k, v)));
    return new Arguments(copy);
  }

  public static Arguments of(String name, Object value) {
    return of(Map.of(name, value));
  }

  /** A builder for arguments with many entries: one map, one copy at the end. */
  public static Builder builder() {
    return new Builder();
  }

  /** Collects entries, then {@link #build()}s immutable arguments. Not thread-safe. */
  public static final class Builder {
    private final TreeMap<String, Object> values = new TreeMap<>();

    private Builder() {}

    public Builder put(String name, Object value) {
      values.put(Objects.requireNonNull(name, "name"), normalise(name, value));
      return this;
    }

    public Arguments build() {
      return new Arguments(new TreeMap<>(values));
    }
  }

  /** Returns a copy with {@code name} set to {@code value}. This instance is unaffected. */
  public Arguments with(String name, Object value) {
    TreeMap<String, Object> copy = new TreeMap<>(values);
    copy.put(Objects.requireNonNull(name, "name"), normalise(name, value));
    return new Arguments(copy);
  }

  /** Returns a copy without {@code name}. This instance is unaffected. */
  public Arguments without(String name) {
    if (!values.containsKey(name)) {
      return this;
    }
    TreeMap<String, Object> copy = new TreeMap<>(values);
    copy.remove(name);
    return new Arguments(copy);
  }

  public boolean has(String name) {
    return values.containsKey(name);
  }

  public boolean isEmpty() {
    return values.isEmpty();
  }

  /** The values, sorted by name; unmodifiable. */
  public Map<String, Object> asMap() {
    return Collections.unmodifiableSortedMap(values);
  }

  // ---- typed getters: a wrong type is the caller's error, reported as invalid_argument ----

  public Optional<String> string(String name) throws ToolException {
    Object v = values.get(name);
    if (v == null) {
      return Optional.empty();
    }
    if (v instanceof String s) {
      return Optional.of(s);
    }
    throw wrongType(name, "a string", v);
  }

  public String requireString(String name) throws ToolException {
    return string(name).orElseThrow(() -> missing(name));
  }

  public Optional<BigDecimal> number(String name) throws ToolException {
    Object v = values.get(name);
    if (v == null) {
      return Optional.empty();
    }
    if (v instanceof BigDecimal d) {
      return Optional.of(d);
    }
    throw wrongType(name, "a number", v);
  }

  public BigDecimal requireNumber(String name) throws ToolException {
    return number(name).orElseThrow(() -> missing(name));
  }

  /** An integer argument; a fraction or a value outside {@code int} is invalid_argument. */
  public Optional<Integer> integer(String name) throws ToolException {
    Optional<BigDecimal> n = number(name);
    if (n.isEmpty()) {
      return Optional.empty();
    }
    try {
      return Optional.of(n.get().intValueExact());
    } catch (ArithmeticException e) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT,
          "argument '" + name + "' must be a whole number within ±2147483647 but was " + n.get().toPlainString());
    }
  }

  public Optional<Boolean> bool(String name) throws ToolException {
    Object v = values.get(name);
    if (v == null) {
      return Optional.empty();
    }
    if (v instanceof Boolean b) {
      return Optional.of(b);
    }
    throw wrongType(name, "a boolean", v);
  }

  /**
   * The canonical JSON form: keys sorted, numbers in plain notation without trailing zeros, no
   * white space. Equal arguments give equal strings; the cache and the ledger use it.
   */
  public String toCanonicalJson() {
    String json = canonicalJson;
    if (json == null) {
      StringBuilder sb = new StringBuilder("{");
      values.forEach((k, v) -> {
        if (sb.length() > 1) {
          sb.append(',');
        }
        quote(sb, k).append(':');
        if (v instanceof String s) {
          quote(sb, s);
        } else if (v instanceof BigDecimal d) {
          sb.append(numberText(d));
        } else {
          sb.append(v);
        }
      });
      json = canonicalJson = sb.append('}').toString();
    }
    return json;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Arguments other && values.equals(other.values);
  }

  @Override
  public int hashCode() {
    int h = hash;
    if (h == 0) {
      h = hash = values.hashCode() | 1;
    }
    return h;
  }

  @Override
  public String toString() {
    return toCanonicalJson();
  }

  private static Object normalise(String name, Object v) {
    Objects.requireNonNull(v, () -> "value of " + name);
    if (v instanceof String || v instanceof Boolean) {
      return v;
    }
    if (v instanceof BigDecimal d) {
      return normaliseNumber(d);
    }
    if (v instanceof Integer || v instanceof Long || v instanceof Short || v instanceof Byte) {
      return normaliseNumber(BigDecimal.valueOf(((Number) v).longValue()));
    }
    if (v instanceof BigInteger b) {
      return normaliseNumber(new BigDecimal(b));
    }
    if (v instanceof Double || v instanceof Float) {
      double d = ((Number) v).doubleValue();
      if (!Double.isFinite(d)) {
        throw new IllegalArgumentException("argument " + name + " is not finite: " + d);
      }
      return normaliseNumber(new BigDecimal(d));
    }
    throw new IllegalArgumentException("argument " + name + " must be a String, Boolean or number: " + v.getClass());
  }

  private static BigDecimal normaliseNumber(BigDecimal d) {
    if (d.signum() == 0) {
      return BigDecimal.ZERO; // one zero: no -0, no 0.00
    }
    return d.stripTrailingZeros(); // the unique representation of the value
  }

  /** Plain notation for moderate magnitudes, scientific beyond (never a million-digit string). */
  private static String numberText(BigDecimal d) {
    int exponent = d.precision() - d.scale() - 1;
    return exponent >= -30 && exponent <= 30 ? d.toPlainString() : d.toString();
  }

  private static StringBuilder quote(StringBuilder sb, String s) {
    return JsonStrings.quote(sb, s);
  }

  private static ToolException wrongType(String name, String expected, Object found) {
    String kind = found instanceof String ? "a string" : found instanceof Boolean ? "a boolean" : "a number";
    return new ToolException(ErrorCode.INVALID_ARGUMENT,
        "argument '" + name + "' must be " + expected + " but was " + kind);
  }

  private static ToolException missing(String name) {
    return new ToolException(ErrorCode.INVALID_ARGUMENT, "argument '" + name + "' is required");
  }
}
