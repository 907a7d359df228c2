package reckoner;

import java.util.List;
import reckoner.arith.ArithTool;
import reckoner.dates.DatesTool;
import reckoner.tool.Tool;

/** The tool versions this build serves, listed explicitly. A new version is one more line. */
public final class Tools {
  private Tools() {}

  public static List<Tool> standard() {
    return List.of(
        new ArithTool(),
        new DatesTool());
  }
}
