package reckoner;

import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.quicktheories.QuickTheory.qt;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.OptionalInt;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolId;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * Every tool version's text form, fed random strings (QuickTheories, fixed seeds): each call ends in
 * an answer or a caller's error, never an exception escaping the tool (which the invoker would
 * turn into internal_error). The strings mix each tool's own vocabulary with digits, operators,
 * white space, control and format characters, combining marks, right-to-left text and emoji.
 */
final class TextFormFuzzTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final Invoker INVOKER = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)),
      Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));

  private static final String[] WORDS = {"to", "in", "from", "days", "ago", "weeks", "business", "next", "last", "of", "km",
      "mi", "kg", "lb", "°C", "F", "cup", "tbsp", "sqrt", "log", "sin", "pi", "e", "mod", "%", "what", "is", "how", "many",
      "2024-02-29", "2024-13-45", "P1M", "PT36H", "America/New_York", "hebrew", "capital", "president", "weekday", "leap",
      "year", "quarter", "iso", "week", "Friday", "March", "3,", "1/2", "5'11\"", "-", "+", "*", "/", "^", "(", ")", "√", "²",
      "×", "÷", "−", "1e308", "1e-400", "0", "00", "9999999999999999999999", ".", ",", "->", "=>", "=", "?", "!"};
  private static final String[] ODD = {"\u0000", "\u0007", "\t", "\n", "\r", "\u200b", "\u200e", "\u202e", "\u2066", "\ufeff",
      "\u0301", "\u0338", "\ud83d\ude00", "\ud800", "\udfff", "\u00a0", "\u3000", "\uff11", "\u0661", "\u0e52", "\ufffd", "\u00ad"};

  static Stream<String> toolVersions() {
    return INVOKER.catalog().all().stream().map(e -> e.tool().id().toString());
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("toolVersions")
  void randomText_answersOrRefuses_neverFails(String id) {
    ToolId tool = ToolId.parse(id);
    Gen<String> texts = in -> {
      StringBuilder sb = new StringBuilder();
      int parts = (int) in.next(Constraint.between(0, 12));
      for (int i = 0; i < parts; i++) {
        switch ((int) in.next(Constraint.between(0, 5))) {
          case 0, 1 -> sb.append(WORDS[(int) in.next(Constraint.between(0, WORDS.length - 1))]);
          case 2 -> sb.append(in.next(Constraint.between(-100000, 100000)));
          case 3 -> sb.append(ODD[(int) in.next(Constraint.between(0, ODD.length - 1))]);
          case 4 -> sb.append((char) in.next(Constraint.between(0x20, 0x7e)));
          default -> sb.append((char) in.next(Constraint.between(0, 0xffff)));
        }
        if (in.next(Constraint.between(0, 2)) > 0) {
          sb.append(' ');
        }
      }
      return sb.toString();
    };
    qt().withExamples(3_000).withFixedSeed(id.hashCode()).forAll(texts).checkAssert(text -> {
      ObjectNode args = JSON.createObjectNode().put("text", text);
      if (INVOKER.catalog().find(tool).orElseThrow().spec().declaresArgument("as_of")) {
        args.put("as_of", "2031-05-17");
      }
      Outcome o = INVOKER.invoke(new CallRequest(tool.name(), OptionalInt.of(tool.version()), args, null, null, null));
      o.error().ifPresent(e -> assertNotEquals(ErrorCode.INTERNAL_ERROR, e.code(), () -> id + " failed on " + JSON.writeValueAsString(text)));
    });
  }
}
