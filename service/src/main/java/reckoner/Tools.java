package reckoner;

import java.util.List;
import reckoner.arith.ArithTool;
import reckoner.arith.ArithToolV2;
import reckoner.dates.DatesTool;
import reckoner.dates.DatesToolV2;
import reckoner.data.DataLoadException;
import reckoner.facts.FactStore;
import reckoner.facts.FactsTool;
import reckoner.search.SearchStore;
import reckoner.search.SearchTool;
import reckoner.tool.Tool;
import reckoner.units.UnitsTool;
import reckoner.units.UnitsToolV2;

/** The tool versions this build serves, listed explicitly. A new version is one more line. */
public final class Tools {
  private Tools() {}

  /** Every served tool version; fact lookups read {@code facts}, searches {@code search}. */
  public static List<Tool> standard(FactStore facts, SearchStore search) {
    return List.of(
        new ArithTool(),
        new ArithToolV2(),
        new DatesTool(),
        new DatesToolV2(),
        new UnitsTool(),
        new UnitsToolV2(),
        new FactsTool(facts),
        new SearchTool(search));
  }

  /** The standard tools over the demo fact sets and the demo collection only: for tests, benchmarks and examples. */
  public static List<Tool> demo() {
    try {
      return standard(FactStore.open(List.of(FactStore.demo()), FactStore.DEMO_DEFAULT_SET), SearchStore.openDemo());
    } catch (DataLoadException e) {
      throw new IllegalStateException("the demo fact sets do not load: " + e.getMessage(), e);
    }
  }
}
