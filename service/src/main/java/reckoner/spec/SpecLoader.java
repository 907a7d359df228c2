package reckoner.spec;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import reckoner.tool.ToolId;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Reads tool specs from the classpath, where the build copies {@code tool-specs/}. A spec that is
 * missing or malformed is a build error and fails the service at start, naming the file.
 */
public final class SpecLoader {
  private final JsonMapper json;

  public SpecLoader(JsonMapper json) {
    this.json = json;
  }

  /** The classpath resource of a tool version's spec. */
  public static String resourceOf(ToolId id) {
    return "tool-specs/" + id.name() + "/" + id.version() + ".json";
  }

  /** Loads and checks the spec of {@code id}. */
  public ToolSpec load(ToolId id) {
    String resource = resourceOf(id);
    try (InputStream in = SpecLoader.class.getClassLoader().getResourceAsStream(resource)) {
      if (in == null) {
        throw new IllegalStateException("no spec for " + id + ": expected the resource " + resource);
      }
      return parse(id, json.readTree(in), resource);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read " + resource, e);
    } catch (JacksonException e) {
      throw new IllegalStateException(resource + " is not valid JSON: " + e.getOriginalMessage(), e);
    }
  }

  static ToolSpec parse(ToolId id, JsonNode doc, String where) {
    require(doc.isObject(), where, "the spec must be a JSON object");
    require("https://json-schema.org/draft/2020-12/schema".equals(doc.path("$schema").asString("")), where,
        "$schema must be https://json-schema.org/draft/2020-12/schema");
    require(id.toString().equals(doc.path("title").asString("")), where, "title must be " + id);
    require(doc.path("additionalProperties").isBoolean() && !doc.path("additionalProperties").asBoolean(), where,
        "additionalProperties must be false: unknown arguments are refused");
    JsonNode ext = doc.path(ToolSpec.EXTENSION);
    require(ext.isObject(), where, ToolSpec.EXTENSION + " must be an object");
    List<ToolSpec.Example> examples = new ArrayList<>();
    for (JsonNode e : ext.path("examples")) {
      String title = e.path("title").asString("");
      require(!title.isEmpty(), where, "every example needs a title");
      require(e.path("args").isObject(), where, "example '" + title + "' needs args");
      examples.add(new ToolSpec.Example(title, e.get("args"),
          e.has("text") ? e.get("text").asString() : null,
          e.has("error") ? e.get("error").asString() : null));
    }
    require(!examples.isEmpty(), where, "a spec needs worked examples");
    return new ToolSpec(id,
        text(ext, "summary", where),
        text(doc, "description", where),
        text(ext, "text_form", where),
        doc, examples);
  }

  private static String text(JsonNode node, String field, String where) {
    String s = node.path(field).asString("");
    require(!s.isBlank(), where, field + " must be a non-empty string");
    return s;
  }

  private static void require(boolean ok, String where, String message) {
    if (!ok) {
      throw new IllegalStateException(where + ": " + message);
    }
  }
}
