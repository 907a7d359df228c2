package reckoner.spec;

import java.util.List;
import java.util.Objects;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * One tool version's published description, read from {@code tool-specs/NAME/VERSION.json}: a JSON
 * Schema (2020-12) document for the arguments whose {@code x-reckoner} member holds the summary,
 * the text form and the worked examples. Immutable.
 */
public record ToolSpec(ToolId id, String summary, String description, String textForm,
    JsonNode document, List<Example> examples) {

  /** The member of a spec document that holds what JSON Schema has no keyword for. */
  public static final String EXTENSION = "x-reckoner";

  public ToolSpec {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(summary, "summary");
    Objects.requireNonNull(description, "description");
    Objects.requireNonNull(textForm, "textForm");
    Objects.requireNonNull(document, "document");
    examples = List.copyOf(examples);
  }

  /** The argument schema alone: the document without {@code $schema}, {@code $id} and the extension. */
  public ObjectNode argumentSchema() {
    ObjectNode schema = ((ObjectNode) document).deepCopy();
    schema.remove("$schema");
    schema.remove("$id");
    schema.remove(EXTENSION);
    return schema;
  }

  /** Whether the schema declares a top-level argument called {@code name}. */
  public boolean declaresArgument(String name) {
    return document.path("properties").has(name);
  }

  /**
   * A worked example: arguments, and either the exact expected text or the expected error code.
   * Tests execute every example; the OpenAPI document shows them.
   */
  public record Example(String title, JsonNode args, String text, String error) {
    public Example {
      Objects.requireNonNull(title, "title");
      Objects.requireNonNull(args, "args");
      if ((text == null) == (error == null)) {
        throw new IllegalArgumentException("an example names exactly one of text or error: " + title);
      }
    }

    public boolean expectsError() {
      return error != null;
    }
  }
}
