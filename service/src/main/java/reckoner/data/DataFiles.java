package reckoner.data;

import java.io.IOException;
import java.io.InputStream;
import java.math.BigDecimal;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import reckoner.io.LineReader;
import tools.jackson.core.JacksonException;
import tools.jackson.core.StreamReadConstraints;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.core.json.JsonFactory;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Reads a JSON Lines data file: lines split by {@link LineReader} (LF, with an optional CR before
 * it), each decoded as strict UTF-8 (a byte order mark on the first line is dropped), blank lines
 * skipped, and every other line parsed by Jackson as exactly one JSON object by RFC 8259: no
 * comments, no trailing commas, no duplicate member names, no raw control characters in strings,
 * nesting at most {@link #MAX_DEPTH} deep. Stateless; thread-safe.
 */
public final class DataFiles {
  /** Deepest nesting a line may have; data records are flat, so this only stops pathological input. */
  public static final int MAX_DEPTH = 8;

  private static final JsonMapper JSON = JsonMapper.builder(JsonFactory.builder()
          .streamReadConstraints(StreamReadConstraints.builder().maxNestingDepth(MAX_DEPTH).maxNumberLength(100).build())
          .build())
      .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
      .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
      .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
      .build();

  /** Takes one parsed line; a {@link DataLine.Problem} is reported at that line and reading goes on. */
  @FunctionalInterface
  public interface LineHandler {
    void line(DataLine line) throws DataLine.Problem;
  }

  /** Receives a problem at a line of the file being read (0: the whole file). */
  @FunctionalInterface
  public interface Problems {
    void add(int line, String reason);
  }

  private DataFiles() {}

  /**
   * Reads every line of {@code input}, handing each parsed object to {@code handler} and every
   * problem (too long, not UTF-8, not one JSON object, or the handler's) to {@code problems}.
   * Never throws for bad content; an unreadable file is one problem at line 0.
   */
  public static void read(DataSource.Input input, int maxLineBytes, LineHandler handler, Problems problems) {
    String file = input.name();
    CharsetDecoder utf8 = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT)
        .onUnmappableCharacter(CodingErrorAction.REPORT);
    try (InputStream in = input.open()) {
      LineReader lines = new LineReader(in, maxLineBytes);
      for (LineReader.Line l = lines.next(); l != null; l = lines.next()) {
        int number = (int) l.number();
        if (l.tooLong()) {
          problems.add(number, "line is longer than " + maxLineBytes + " bytes");
          continue;
        }
        String text;
        try {
          text = utf8.decode(ByteBuffer.wrap(l.bytes())).toString();
        } catch (CharacterCodingException e) {
          problems.add(number, "not valid UTF-8");
          continue;
        }
        if (number == 1 && text.startsWith("\uFEFF")) {
          text = text.substring(1); // a byte order mark some editors write
        }
        if (text.isBlank()) {
          continue;
        }
        try {
          handler.line(new DataLine(file, number, parseObject(text)));
        } catch (DataLine.Problem e) {
          problems.add(number, e.getMessage());
        }
      }
    } catch (IOException e) {
      problems.add(0, "cannot read: " + e.getMessage());
    }
  }

  /** Parses {@code line}, which must hold exactly one JSON object, into member values as {@link DataLine} describes. */
  static Map<String, Object> parseObject(String line) throws DataLine.Problem {
    JsonNode node;
    try {
      node = JSON.readTree(line);
    } catch (JacksonException e) {
      int column = e.getLocation() == null ? 0 : e.getLocation().getColumnNr();
      throw new DataLine.Problem("not a JSON object" + (column > 0 ? " at column " + column : "") + ": "
          + reason(e.getOriginalMessage()));
    }
    if (node == null || !node.isObject()) {
      throw new DataLine.Problem("not a JSON object at column 1: expected a JSON object starting with '{'");
    }
    @SuppressWarnings("unchecked") // an object node converts to a map
    Map<String, Object> members = (Map<String, Object>) value(node);
    return members;
  }

  /** Jackson's message, first line, without its pointers into Jackson's own configuration and source. */
  private static String reason(String message) {
    if (message.startsWith("Trailing token")) {
      return "unexpected text after the object";
    }
    int end = message.indexOf('\n');
    String line = end < 0 ? message : message.substring(0, end);
    int marker = line.indexOf(" (start marker at");
    return marker < 0 ? line : line.substring(0, marker);
  }

  private static Object value(JsonNode node) {
    if (node.isObject()) {
      Map<String, Object> members = new LinkedHashMap<>();
      for (Map.Entry<String, JsonNode> e : node.properties()) {
        members.put(e.getKey(), value(e.getValue()));
      }
      return Collections.unmodifiableMap(members);
    }
    if (node.isArray()) {
      List<Object> items = new ArrayList<>(node.size());
      for (JsonNode item : node) {
        items.add(value(item));
      }
      return Collections.unmodifiableList(items);
    }
    if (node.isString()) {
      return node.stringValue();
    }
    if (node.isBoolean()) {
      return node.booleanValue();
    }
    if (node.isNumber()) {
      return node.isIntegralNumber() ? new BigDecimal(node.bigIntegerValue()) : node.decimalValue();
    }
    return DataLine.NULL;
  }
}
