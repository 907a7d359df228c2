package reckoner.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Reading JSON Lines data files: strict JSON by RFC 8259 through Jackson, line splitting, UTF-8, limits. */
final class DataFilesTest {
  private static DataSource.Input input(byte[] bytes) {
    return new DataSource.Input() {
      @Override
      public String name() {
        return "mem.jsonl";
      }

      @Override
      public InputStream open() {
        return new ByteArrayInputStream(bytes);
      }
    };
  }

  private static List<String> read(String content, int maxLineBytes) {
    List<String> seen = new ArrayList<>();
    DataFiles.read(input(content.getBytes(StandardCharsets.UTF_8)), maxLineBytes,
        line -> seen.add(line.number() + " " + line.members()), (line, reason) -> seen.add(line + "! " + reason));
    return seen;
  }

  @Test
  void parseObject_valuesOfEveryKind_keepTheirTypesAndOrder() throws DataLine.Problem {
    Map<String, Object> m = DataFiles.parseObject("{\"s\":\"x\",\"b\":true,\"n\":2.50,\"i\":7,\"a\":[1,\"y\"],\"o\":{\"k\":null}}");
    assertEquals(List.of("s", "b", "n", "i", "a", "o"), List.copyOf(m.keySet()));
    assertEquals("x", m.get("s"));
    assertEquals(Boolean.TRUE, m.get("b"));
    assertEquals(new BigDecimal("2.50"), m.get("n"));
    assertEquals(new BigDecimal("7"), m.get("i"));
    assertEquals(List.of(new BigDecimal("1"), "y"), m.get("a"));
    assertEquals(Map.of("k", DataLine.NULL), m.get("o"));
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "a comment|{\"a\":1} // note|not a JSON object at column 9: Unexpected character ('/' (code 47)): maybe a (non-standard) comment? (not recognized as one since Feature 'ALLOW_COMMENTS' not enabled for parser)",
      "single quotes|{'a':1}|not a JSON object at column 2: Unexpected character (''' (code 39)): was expecting double-quote to start property name",
      "a trailing comma|{\"a\":1,}|not a JSON object at column 8: Unexpected character ('}' (code 125)): was expecting double-quote to start property name",
      "a duplicate member|{\"a\":1,\"a\":2}|not a JSON object at column 11: Duplicate Object property \"a\"",
      "two objects|{} {}|not a JSON object at column 4: unexpected text after the object",
      "an array|[{}]|not a JSON object at column 1: expected a JSON object starting with '{'",
      "a string|\"x\"|not a JSON object at column 1: expected a JSON object starting with '{'",
      "an unclosed object|{\"a\":1|not a JSON object at column 7: Unexpected end-of-input: expected close marker for Object",
      "nesting too deep|{\"a\":[[[[[[[[1]]]]]]]]}|not a JSON object: Document nesting depth (9) exceeds the maximum allowed (8, from `StreamReadConstraints.getMaxNestingDepth()`)"})
  void parseObject_malformed_saysWhereAndWhy(String title, String line, String reason) {
    DataLine.Problem e = assertThrows(DataLine.Problem.class, () -> DataFiles.parseObject(line));
    assertEquals(reason, e.getMessage());
  }

  @Test
  void parseObject_rawControlCharacterInAString_isRefused() {
    DataLine.Problem e = assertThrows(DataLine.Problem.class, () -> DataFiles.parseObject("{\"a\":\"x\ty\"}"));
    assertEquals("not a JSON object at column 8: Illegal unquoted character ((CTRL-CHAR, code 9)): has to be escaped using"
        + " backslash to be included in string value", e.getMessage());
  }

  @Test
  void read_linesBlankLinesCrLfAndByteOrderMark_areHandled() {
    assertEquals(List.of("1 {a=1}", "3 {b=2}", "4 {c=3}"), read("\uFEFF{\"a\":1}\r\n  \n{\"b\":2}\n{\"c\":3}", 100));
  }

  @Test
  void read_lineOverTheLimit_isReportedAndTheNextLineRead() {
    assertEquals(List.of("1! line is longer than 10 bytes", "2 {a=1}"), read("{\"a\":\"0123456789\"}\n{\"a\":1}\n", 10));
  }

  @Test
  void read_invalidUtf8_isReportedAtItsLine() {
    byte[] bytes = {'{', '}', '\n', '{', '"', 'a', '"', ':', '"', (byte) 0xC3, '"', '}', '\n'};
    List<String> seen = new ArrayList<>();
    DataFiles.read(input(bytes), 100, line -> seen.add(line.number() + " ok"), (line, reason) -> seen.add(line + "! " + reason));
    assertEquals(List.of("1 ok", "2! not valid UTF-8"), seen);
  }

  @Test
  void read_handlerProblem_isReportedAtTheLine() {
    List<String> seen = new ArrayList<>();
    DataFiles.read(input("{}\n{}\n".getBytes(StandardCharsets.UTF_8)), 100, line -> {
      throw new DataLine.Problem("no good at " + line.file());
    }, (line, reason) -> seen.add(line + "! " + reason));
    assertEquals(List.of("1! no good at mem.jsonl", "2! no good at mem.jsonl"), seen);
  }

  @Test
  void contentDigest_fieldBoundariesAndAbsentFields_giveDifferentVersions() {
    String ab = ContentDigest.of("f").put("ab").put("c").version();
    String a = ContentDigest.of("f").put("a").put("bc").version();
    String absent = ContentDigest.of("f").put(null).put("abc").version();
    String empty = ContentDigest.of("f").put("").put("abc").version();
    assertEquals(4, List.of(ab, a, absent, empty).stream().distinct().count());
    assertEquals(ab, ContentDigest.of("f").put("ab").put("c").version());
  }

  @Test
  void contentDigest_ofKnownBytes_matchesSha256() throws Exception {
    // Field "abc": length 00 00 00 03 then the bytes; SHA-256 of those 7 bytes by the JDK's own MessageDigest.
    byte[] bytes = {0, 0, 0, 3, 'a', 'b', 'c'};
    byte[] sha = java.security.MessageDigest.getInstance("SHA-256").digest(bytes);
    assertEquals("sha256:" + java.util.HexFormat.of().formatHex(sha, 0, 8), ContentDigest.of("abc").version());
  }
}
