package reckoner;

import java.util.List;
import reckoner.arith.ArithTool;
import reckoner.arith.ArithToolV2;
import reckoner.dates.DatesTool;
import reckoner.facts.FactLoadException;
import reckoner.facts.FactSource;
import reckoner.facts.FactStore;
import reckoner.facts.FactsTool;
import reckoner.tool.Tool;
import reckoner.units.UnitsTool;

/** The tool versions this build serves, listed explicitly. A new version is one more line. */
public final class Tools {
  private Tools() {}

  /** Every served tool version; fact lookups read {@code facts}. */
  public static List<Tool> standard(FactStore facts) {
    return List.of(
        new ArithTool(),
        new ArithToolV2(),
        new DatesTool(),
        new UnitsTool(),
        new FactsTool(facts));
  }

  /** The standard tools over the demo fact sets only: for tests, benchmarks and examples. */
  public static List<Tool> demo() {
    try {
      return standard(FactStore.open(List.of(FactSource.demo()), FactSource.DEMO_DEFAULT_SET));
    } catch (FactLoadException e) {
      throw new IllegalStateException("the demo fact sets do not load: " + e.getMessage(), e);
    }
  }
}
