package reckoner.spec;

import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SchemaRegistryConfig;
import com.networknt.schema.SpecificationVersion;
import java.util.Locale;
import java.util.List;
import java.util.Optional;
import tools.jackson.databind.JsonNode;

/**
 * Checks a call's arguments against its tool version's JSON Schema (draft 2020-12) before the tool
 * sees them. Compiled once per spec; thread-safe.
 */
public final class ArgumentValidator {
  // Messages in English whatever the JVM's default locale: they become answer text.
  private static final SchemaRegistry REGISTRY = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12,
      builder -> builder.schemaRegistryConfig(SchemaRegistryConfig.builder().locale(Locale.ENGLISH).build()));
  private final Schema schema;
  private final List<String> alternatives; // the members of which exactly one must be given, in words; empty: old wording

  private ArgumentValidator(Schema schema, List<String> alternatives) {
    this.schema = schema;
    this.alternatives = alternatives;
  }

  /**
   * A validator for {@code spec}. With {@code plainWords}, a call that gives more than one (or none)
   * of the members a top-level {@code oneOf} asks one of is told so in words ("give either expr or
   * text, not both"); without it, the validator's own sentence is kept, as version 1 published it.
   */
  public static ArgumentValidator of(ToolSpec spec, boolean plainWords) {
    Schema schema = REGISTRY.getSchema(spec.argumentSchema());
    schema.initializeValidators(); // compile now, not on the first call
    List<String> alternatives = new java.util.ArrayList<>();
    if (plainWords) {
      for (JsonNode branch : spec.argumentSchema().path("oneOf")) {
        JsonNode required = branch.path("required");
        if (required.size() == 1 && branch.size() == 1) {
          alternatives.add(required.get(0).asString());
        }
      }
      if (alternatives.size() != spec.argumentSchema().path("oneOf").size()) {
        alternatives.clear(); // a oneOf of other shapes keeps the validator's sentence
      }
    }
    return new ArgumentValidator(schema, List.copyOf(alternatives));
  }

  /**
   * Returns empty if {@code args} is valid, else one sentence naming the first violation and where
   * it is, in words a caller can act on.
   */
  public Optional<String> check(JsonNode args) {
    if (!args.isObject()) {
      return Optional.of("the arguments must be a JSON object");
    }
    List<Error> errors;
    try {
      errors = schema.validate(args);
    } catch (RuntimeException e) {
      // The validator converts bounded numbers to long and fails on values beyond that range
      // (seen with 1e100 against "maximum"); such a value is out of range for us too.
      return Optional.of(outOfRange(args));
    }
    if (errors.isEmpty()) {
      return Optional.empty();
    }
    if (!alternatives.isEmpty() && "oneOf".equals(errors.get(0).getKeyword())) {
      long given = alternatives.stream().filter(args::has).count();
      if (given != 1) {
        String choice = alternatives.size() == 2 ? alternatives.get(0) + " or " + alternatives.get(1)
            : String.join(", ", alternatives.subList(0, alternatives.size() - 1)) + " or " + alternatives.get(alternatives.size() - 1);
        return Optional.of(given == 0 ? "give " + choice : "give either " + choice + ", not " + (given == 2 ? "both" : "several"));
      }
    }
    return Optional.of(describe(errors.get(0)) + (errors.size() > 1 ? " (and " + (errors.size() - 1) + " more)" : ""));
  }

  private static String outOfRange(JsonNode args) {
    for (java.util.Map.Entry<String, JsonNode> e : args.properties()) {
      JsonNode v = e.getValue();
      if (v.isNumber() && v.decimalValue().abs().compareTo(java.math.BigDecimal.valueOf(Long.MAX_VALUE)) > 0) {
        return "argument '" + e.getKey() + "' is out of range: " + shortText(v.decimalValue());
      }
    }
    return "the arguments could not be checked against the schema";
  }

  private static String shortText(java.math.BigDecimal d) {
    String s = d.toString();
    return s.length() <= 24 ? s : s.substring(0, 20) + "…";
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
