package reckoner.spec;

import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.util.List;
import java.util.Optional;
import tools.jackson.databind.JsonNode;

/**
 * Checks a call's arguments against its tool version's JSON Schema (draft 2020-12) before the tool
 * sees them. Compiled once per spec; thread-safe.
 */
public final class ArgumentValidator {
  private static final SchemaRegistry REGISTRY = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12);
  private final Schema schema;

  private ArgumentValidator(Schema schema) {
    this.schema = schema;
  }

  public static ArgumentValidator of(ToolSpec spec) {
    Schema schema = REGISTRY.getSchema(spec.argumentSchema());
    schema.initializeValidators(); // compile now, not on the first call
    return new ArgumentValidator(schema);
  }

  /**
   * Returns empty if {@code args} is valid, else one sentence naming the first violation and where
   * it is, in words a caller can act on.
   */
  public Optional<String> check(JsonNode args) {
    if (!args.isObject()) {
      return Optional.of("the arguments must be a JSON object");
    }
    List<Error> errors = schema.validate(args);
    if (errors.isEmpty()) {
      return Optional.empty();
    }
    return Optional.of(describe(errors.get(0)) + (errors.size() > 1 ? " (and " + (errors.size() - 1) + " more)" : ""));
  }

  private static String describe(Error e) {
    String where = e.getInstanceLocation().toString();
    String keyword = e.getKeyword();
    if ("additionalProperties".equals(keyword) && e.getProperty() != null) {
      return "unknown argument '" + e.getProperty() + "'";
    }
    if ("required".equals(keyword) && e.getProperty() != null) {
      return "missing argument '" + e.getProperty() + "'";
    }
    String message = e.getMessage();
    return message.startsWith(where) ? message : where + ": " + message;
  }
}
