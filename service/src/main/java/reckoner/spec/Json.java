package reckoner.spec;

import tools.jackson.core.StreamReadConstraints;
import tools.jackson.core.json.JsonFactory;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.json.JsonMapper;

/** The one JSON configuration of the service: exact decimals, bounded input, no duplicate keys. */
public final class Json {
  /** Deepest nesting a request body may have; tool arguments are flat, so this is generous. */
  public static final int MAX_NESTING = 64;

  private Json() {}

  public static JsonMapper newMapper() {
    JsonFactory factory = JsonFactory.builder()
        .streamReadConstraints(StreamReadConstraints.builder()
            .maxNestingDepth(MAX_NESTING)
            .maxNumberLength(1000)
            .maxStringLength(10_000_000)
            .build())
        .build();
    return JsonMapper.builder(factory)
        .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
        .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
        .enable(tools.jackson.core.StreamReadFeature.STRICT_DUPLICATE_DETECTION)
        .build();
  }
}
