package reckoner.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** What a call whose arguments break its schema is told. */
final class ArgumentValidatorTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final ToolSpec SPEC = new ToolSpec(ToolId.of("sample", 2), "s", "d", "t", JSON.readTree(
      "{\"type\":\"object\",\"properties\":{\"expr\":{\"type\":\"string\"},\"text\":{\"type\":\"string\"},"
          + "\"places\":{\"type\":\"integer\"}},\"additionalProperties\":false,"
          + "\"oneOf\":[{\"required\":[\"expr\"]},{\"required\":[\"text\"]}]}"), List.of());

  private static Optional<String> check(boolean plainWords, String args) {
    return ArgumentValidator.of(SPEC, plainWords).check(JSON.readTree(args));
  }

  @Test
  void bothAlternatives_inPlainWords_sayNotBoth() {
    assertEquals(Optional.of("give either expr or text, not both"), check(true, "{\"expr\":\"1\",\"text\":\"1\"}"));
  }

  @Test
  void noAlternative_inPlainWords_namesThem() {
    assertEquals(Optional.of("give expr or text"), check(true, "{\"places\":2}"));
  }

  @Test
  void bothAlternatives_asVersion1Published_keepTheValidatorsSentence() {
    // facts@1 and the other version 1 tools answered this sentence; their answers never change.
    assertEquals(Optional.of("must be valid to one and only one schema, but 2 are valid with indexes '0, 1'"),
        check(false, "{\"expr\":\"1\",\"text\":\"1\"}"));
  }

  @Test
  void otherViolations_unchanged() {
    JsonNode args = JSON.readTree("{\"expr\":\"1\",\"precision\":3}");
    assertEquals(Optional.of("unknown argument 'precision'"), ArgumentValidator.of(SPEC, true).check(args));
    assertEquals(Optional.empty(), check(true, "{\"text\":\"1\"}"));
  }
}
