package reckoner.dates;

import java.util.LinkedHashMap;
import java.util.Map;
import reckoner.tool.Arguments;
import tools.jackson.databind.JsonNode;

/** Builds tool {@link Arguments} from a JSON object of string values, for tests that call the tool directly. */
final class DatesCallsArguments {
  private DatesCallsArguments() {}

  static Arguments of(String json) {
    Map<String, Object> values = new LinkedHashMap<>();
    for (Map.Entry<String, JsonNode> e : DatesCalls.json(json).properties()) {
      values.put(e.getKey(), e.getValue().asString());
    }
    return Arguments.of(values);
  }
}
