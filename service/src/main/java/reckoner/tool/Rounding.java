package reckoner.tool;

import java.math.RoundingMode;
import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * The seven rounding modes a caller can ask for, by their wire names. {@code half_even} is IEEE
 * 754-2019 roundTiesToEven (the default); {@code half_up} is roundTiesToAway (ties away from zero,
 * also for negative numbers); {@code half_down} takes ties toward zero; {@code up} and
 * {@code down} round away from and toward zero; {@code ceiling} and {@code floor} toward positive
 * and negative infinity.
 */
public enum Rounding {
  HALF_EVEN(RoundingMode.HALF_EVEN),
  HALF_UP(RoundingMode.HALF_UP),
  HALF_DOWN(RoundingMode.HALF_DOWN),
  UP(RoundingMode.UP),
  DOWN(RoundingMode.DOWN),
  CEILING(RoundingMode.CEILING),
  FLOOR(RoundingMode.FLOOR);

  private final RoundingMode mode;
  private final String wireName = name().toLowerCase(Locale.ROOT);

  Rounding(RoundingMode mode) {
    this.mode = mode;
  }

  public RoundingMode mode() {
    return mode;
  }

  public String wireName() {
    return wireName;
  }

  public static Optional<Rounding> parse(String wire) {
    return Arrays.stream(values()).filter(r -> r.wireName.equals(wire)).findFirst();
  }

  /** Parses a wire name or fails with invalid_argument listing the accepted names. */
  public static Rounding require(String wire) throws ToolException {
    Optional<Rounding> r = parse(wire);
    if (r.isEmpty()) {
      throw new ToolException(ErrorCode.INVALID_ARGUMENT, "rounding must be one of "
          + Arrays.stream(values()).map(Rounding::wireName).collect(Collectors.joining(", ")) + " but was '"
          + ResultText.clean(wire, 40) + "'");
    }
    return r.get();
  }
}
