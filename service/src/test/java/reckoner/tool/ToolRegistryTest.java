package reckoner.tool;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

final class ToolRegistryTest {
  /** A stand-in tool that answers its own id, so a test can see which version served. */
  record Echo(ToolId id) implements Tool {
    public Arguments canonicalize(Arguments args) {
      return args;
    }

    public Answer invoke(Arguments canonical, CallContext context) {
      return Answer.of(id.toString());
    }
  }

  @Test
  void newest_severalVersionsSideBySide_isTheHighest() throws ToolException {
    ToolRegistry r = ToolRegistry.of(List.of(new Echo(ToolId.of("echo", 1)), new Echo(ToolId.of("echo", 3)), new Echo(ToolId.of("echo", 2))));
    assertEquals("echo@3", r.newest("echo").get().invoke(Arguments.empty(), CallContext.systemUtc()).text());
    assertEquals("echo@1", r.find(ToolId.of("echo", 1)).get().invoke(Arguments.empty(), CallContext.systemUtc()).text());
    assertEquals(List.of(1, 2, 3), r.versions("echo"));
    assertEquals(3, r.all().size());
  }

  @Test
  void find_unknown_isEmpty() {
    ToolRegistry r = ToolRegistry.of(List.of(new Echo(ToolId.of("echo", 1))));
    assertTrue(r.find(ToolId.of("echo", 2)).isEmpty());
    assertTrue(r.newest("other").isEmpty());
    assertEquals(List.of(), r.versions("other"));
  }

  @Test
  void of_sameIdTwice_isAWiringError() {
    assertThrows(IllegalArgumentException.class,
        () -> ToolRegistry.of(List.of(new Echo(ToolId.of("echo", 1)), new Echo(ToolId.of("echo", 1)))));
  }
}
