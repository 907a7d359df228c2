package reckoner.units;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * The names of the dimensions that have one, used by the unit table's dimension column and in
 * {@code dimension_mismatch} details ({@code cannot convert length to mass}). A dimension without
 * a name is described by its formula in base words. Where two kinds of quantity share a dimension
 * (energy and torque), the name says both.
 */
final class DimensionNames {
  private static final Map<String, Dimension> BY_NAME;
  private static final Map<Dimension, String> BY_DIMENSION;

  static {
    Map<String, Dimension> m = new LinkedHashMap<>();
    m.put("dimensionless", Dimension.NONE);
    m.put("length", Dimension.parse("L"));
    m.put("area", Dimension.parse("L2"));
    m.put("volume", Dimension.parse("L3"));
    m.put("mass", Dimension.parse("M"));
    m.put("time", Dimension.parse("T"));
    m.put("electric current", Dimension.parse("I"));
    m.put("temperature", Dimension.parse("Θ"));
    m.put("amount of substance", Dimension.parse("N"));
    m.put("luminous intensity", Dimension.parse("J"));
    m.put("angle", Dimension.parse("A"));
    m.put("information", Dimension.parse("D"));
    m.put("speed", Dimension.parse("L T-1"));
    m.put("acceleration", Dimension.parse("L T-2"));
    m.put("force", Dimension.parse("L M T-2"));
    m.put("pressure", Dimension.parse("L-1 M T-2"));
    m.put("energy or torque", Dimension.parse("L2 M T-2"));
    m.put("power", Dimension.parse("L2 M T-3"));
    m.put("frequency", Dimension.parse("T-1"));
    m.put("density", Dimension.parse("L-3 M"));
    m.put("volume flow rate", Dimension.parse("L3 T-1"));
    m.put("mass flow rate", Dimension.parse("M T-1"));
    m.put("fuel economy (length per volume)", Dimension.parse("L-2"));
    m.put("pace (time per length)", Dimension.parse("L-1 T"));
    m.put("wavenumber (per length)", Dimension.parse("L-1"));
    m.put("electric charge", Dimension.parse("T I"));
    m.put("voltage", Dimension.parse("L2 M T-3 I-1"));
    m.put("electric resistance", Dimension.parse("L2 M T-3 I-2"));
    m.put("electric conductance", Dimension.parse("L-2 M-1 T3 I2"));
    m.put("capacitance", Dimension.parse("L-2 M-1 T4 I2"));
    m.put("inductance", Dimension.parse("L2 M T-2 I-2"));
    m.put("magnetic flux", Dimension.parse("L2 M T-2 I-1"));
    m.put("magnetic flux density", Dimension.parse("M T-2 I-1"));
    m.put("magnetic field strength", Dimension.parse("L-1 I"));
    m.put("angular speed", Dimension.parse("A T-1"));
    m.put("angular acceleration", Dimension.parse("A T-2"));
    m.put("solid angle", Dimension.parse("A2"));
    m.put("luminous flux", Dimension.parse("J A2"));
    m.put("illuminance", Dimension.parse("L-2 J A2"));
    m.put("luminance", Dimension.parse("L-2 J"));
    m.put("data rate", Dimension.parse("T-1 D"));
    m.put("amount concentration", Dimension.parse("L-3 N"));
    m.put("catalytic activity", Dimension.parse("T-1 N"));
    m.put("dynamic viscosity", Dimension.parse("L-1 M T-1"));
    m.put("kinematic viscosity", Dimension.parse("L2 T-1"));
    m.put("linear density", Dimension.parse("L-1 M"));
    m.put("area density", Dimension.parse("L-2 M"));
    m.put("energy per area", Dimension.parse("M T-2"));
    m.put("irradiance", Dimension.parse("M T-3"));
    m.put("specific energy", Dimension.parse("L2 T-2"));
    m.put("thermal insulance", Dimension.parse("M-1 T3 Θ"));
    m.put("momentum", Dimension.parse("L M T-1"));
    m.put("molar mass", Dimension.parse("M N-1"));
    m.put("heat capacity", Dimension.parse("L2 M T-2 Θ-1"));
    m.put("specific heat capacity", Dimension.parse("L2 T-2 Θ-1"));
    m.put("thermal conductivity", Dimension.parse("L M T-3 Θ-1"));
    Map<Dimension, String> inverse = new LinkedHashMap<>();
    m.forEach((name, dim) -> {
      if (inverse.put(dim, name) != null) {
        throw new ExceptionInInitializerError("two names for one dimension: " + name);
      }
    });
    BY_NAME = Collections.unmodifiableMap(m);
    BY_DIMENSION = Collections.unmodifiableMap(inverse);
  }

  private static final Dimension AREA = Dimension.parse("L2");

  private DimensionNames() {}

  /** The dimension a table row names, if the name is known. */
  static Optional<Dimension> forName(String name) {
    return Optional.ofNullable(BY_NAME.get(name));
  }

  /** The dimension's name, or its formula in base words when it has none. */
  static String describe(Dimension dimension) {
    if (dimension.equals(AREA)) {
      return "area or fuel consumption";
    }
    String name = BY_DIMENSION.get(dimension);
    return name != null ? name : dimension.formulaInWords();
  }

  static Map<String, Dimension> all() {
    return BY_NAME;
  }
}
