package reckoner.arith;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/**
 * arith@2 against the General Decimal Arithmetic test cases (Cowlishaw, IBM, version 2.59), read
 * where Debian's package {@code libpython3.11-testsuite} installs them for CPython's own
 * {@code decimal} tests ({@code /usr/lib/python3.11/test/decimaltestdata/}, or the directory in
 * {@code RECKONER_DECTEST_DIR}); {@code .ci/run} installs the package. The files are IBM's ("all
 * rights reserved", offered as-is), so they are read from the package, not copied into this
 * repository. Each applicable case becomes one arith@2 call — the operation as an
 * expression of its operands, the context's precision as {@code digits}, its rounding as
 * {@code rounding} — in the {@code expr} and in the {@code text} form, and the answer's value must
 * equal the case's result (arith answers values: the result's exponent, which the cases also
 * fix, is a display matter arith leaves to {@code pad_zeros}). A case whose result is an
 * error condition arith also reports (division by zero, invalid operation) must be refused with
 * {@code domain_error}. Cases outside arith@2's domain are counted under the reason they are skipped.
 */
final class GeneralDecimalArithmeticTest {
  private static final String[] FILES = {"add", "subtract", "multiply", "divide", "remainder", "power", "rounding",
      "plus", "minus", "abs", "squareroot"};
  private static final Set<String> ROUNDINGS = Set.of("ceiling", "down", "floor", "half_down", "half_even", "half_up", "up");
  private static final BigDecimal MAX = new BigDecimal("1e9999");
  private static final BigDecimal MIN = new BigDecimal("1e-9999");

  private final ArithToolV2 tool = new ArithToolV2();

  /** One test case with the context it runs in. */
  private record Case(String file, String id, String op, List<String> operands, String result, List<String> conditions,
      int precision, String rounding, boolean extended) {}

  @Test
  void applicableCases_giveTheCaseResult_inBothForms() throws IOException {
    Map<String, Integer> skipped = new TreeMap<>();
    List<String> failures = new ArrayList<>();
    int read = 0;
    int ran = 0;
    for (String file : FILES) {
      for (Case c : read(file)) {
        read++;
        String reason = skipReason(c);
        if (reason != null) {
          skipped.merge(reason, 1, Integer::sum);
          continue;
        }
        ran++;
        String expr = expression(c);
        for (String form : new String[] {"expr", "text"}) {
          String problem = check(c, form, expr);
          if (problem != null) {
            failures.add(c.file() + " " + c.id() + " (" + form + "): " + expr + " digits " + c.precision() + " "
                + c.rounding() + ": " + problem);
          }
        }
      }
    }
    StringBuilder report = new StringBuilder(String.format(Locale.ROOT,
        "decTest: %d cases read, %d ran in both forms, %d failed; skipped:", read, ran, failures.size()));
    skipped.forEach((reason, n) -> report.append(String.format(Locale.ROOT, "%n  %5d  %s", n, reason)));
    System.out.println(report);
    assertTrue(ran >= 3000, report::toString);
    assertEquals(List.of(), failures.subList(0, Math.min(30, failures.size())), failures.size() + " failures; " + report);
  }

  /** Null when arith@2 answers the case as it expects, else what differs. */
  private String check(Case c, String form, String expr) {
    Map<String, Object> args = new LinkedHashMap<>();
    args.put(form, expr);
    args.put("digits", c.precision());
    args.put("rounding", c.rounding());
    String text;
    String code = null;
    try {
      text = tool.invoke(tool.canonicalize(Arguments.of(args)), CallContext.systemUtc()).text();
    } catch (ToolException e) {
      text = e.error().text();
      code = e.error().code().wireName();
    }
    if (expectsDomainError(c)) {
      return "domain_error".equals(code) ? null : "expected domain_error but got " + text;
    }
    if (code != null) {
      return "expected " + c.result() + " but got " + text;
    }
    BigDecimal expected = new BigDecimal(c.result());
    return new BigDecimal(text).compareTo(expected) == 0 ? null : "expected " + c.result() + " but got " + text;
  }

  private static boolean expectsDomainError(Case c) {
    return c.conditions().contains("Division_by_zero") || c.conditions().contains("Division_undefined")
        || c.conditions().contains("Invalid_operation");
  }

  /** Why arith@2 does not take this case, or null when it does. */
  private static String skipReason(Case c) {
    if (!Set.of("add", "subtract", "multiply", "divide", "remainder", "power", "plus", "minus", "abs", "squareroot").contains(c.op())) {
      return "an operation arith does not offer (" + c.op() + ")";
    }
    if (!c.extended()) {
      return "the subset arithmetic (extended: 0) of an older specification";
    }
    for (String o : c.operands()) {
      if (!isNumber(o)) {
        return "a special value operand (NaN, Infinity, sNaN or an encoding)";
      }
      if (outOfRange(new BigDecimal(o))) {
        return "an operand beyond arith's range 1e-9999 <= |x| <= 1e9999";
      }
    }
    if (c.precision() > 34 || c.precision() < 1) {
      return "a precision above 34 (arith's digits is 1 to 34)";
    }
    if (!ROUNDINGS.contains(c.rounding())) {
      return "the rounding 05up, which arith does not offer";
    }
    for (String condition : List.of("Overflow", "Underflow", "Subnormal", "Clamped")) {
      if (c.conditions().contains(condition)) {
        return "a result at the context's exponent limits (overflow, underflow, subnormal, clamped)";
      }
    }
    if (c.conditions().contains("Division_impossible")) {
      return "remainder's limit on the quotient's digits, which arith does not have";
    }
    if (c.conditions().contains("Invalid_context") || c.conditions().contains("Lost_digits")) {
      return "an invalid context or lost digits";
    }
    if (c.op().equals("power")) {
      BigDecimal exponent = new BigDecimal(c.operands().get(1));
      if (exponent.signum() != 0 && exponent.stripTrailingZeros().scale() > 0) {
        return "a fractional power (arith computes those in binary64)";
      }
      if (exponent.abs().compareTo(BigDecimal.valueOf(RealFunctions.MAX_POWER)) > 0) {
        return "a whole exponent beyond arith's ±100000";
      }
      if (new BigDecimal(c.operands().get(0)).signum() == 0 && exponent.signum() == 0) {
        return "0^0, which arith answers 1 as IEEE 754 pow does and the specification calls invalid";
      }
    }
    if (!expectsDomainError(c)) {
      if (!isNumber(c.result())) {
        return "a special value result (NaN or Infinity)";
      }
      if (outOfRange(new BigDecimal(c.result()))) {
        return "a result beyond arith's range";
      }
    }
    return null;
  }

  private static boolean isNumber(String s) {
    try {
      new BigDecimal(s);
      return true;
    } catch (NumberFormatException e) {
      return false;
    }
  }

  private static boolean outOfRange(BigDecimal x) {
    return x.signum() != 0 && (x.abs().compareTo(MAX) > 0 || x.abs().compareTo(MIN) < 0);
  }

  /** The case as an arith expression: operands in parentheses, as BigDecimal writes them. */
  private static String expression(Case c) {
    List<String> o = new ArrayList<>();
    for (String operand : c.operands()) {
      o.add("(" + new BigDecimal(operand) + ")");
    }
    return switch (c.op()) {
      case "add" -> o.get(0) + " + " + o.get(1);
      case "subtract" -> o.get(0) + " - " + o.get(1);
      case "multiply" -> o.get(0) + " * " + o.get(1);
      case "divide" -> o.get(0) + " / " + o.get(1);
      case "remainder" -> "rem(" + o.get(0) + ", " + o.get(1) + ")";
      case "power" -> o.get(0) + " ^ " + o.get(1);
      case "plus" -> o.get(0);
      case "minus" -> "-" + o.get(0);
      case "abs" -> "abs(" + o.get(0) + ")";
      case "squareroot" -> "sqrt(" + o.get(0) + ")";
      default -> throw new IllegalArgumentException(c.op());
    };
  }

  // ---- reading the files ----

  /** Where the decTest files are: RECKONER_DECTEST_DIR, or the newest Python's test data of Debian's package. */
  static java.nio.file.Path dir() throws IOException {
    String env = System.getenv("RECKONER_DECTEST_DIR");
    java.nio.file.Path found = null;
    if (env != null) {
      found = java.nio.file.Path.of(env);
    } else {
      try (java.util.stream.Stream<java.nio.file.Path> libs = java.nio.file.Files.list(java.nio.file.Path.of("/usr/lib"))) {
        found = libs.filter(p -> p.getFileName().toString().matches("python3\\.\\d+"))
            .map(p -> p.resolve("test/decimaltestdata")).filter(java.nio.file.Files::isDirectory)
            .max(java.util.Comparator.naturalOrder()).orElse(null);
      } catch (java.nio.file.NoSuchFileException e) {
        found = null;
      }
    }
    reckoner.Prerequisites.require(found != null && java.nio.file.Files.isRegularFile(found.resolve("add.decTest")),
        "the General Decimal Arithmetic test cases: apt-get install libpython3.11-testsuite, or set RECKONER_DECTEST_DIR");
    return found;
  }

  private static List<Case> read(String name) throws IOException {
    List<Case> cases = new ArrayList<>();
    int precision = 9;
    String rounding = "half_up";
    boolean extended = true;
    try (InputStream in = java.nio.file.Files.newInputStream(dir().resolve(name + ".decTest"));
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        List<String> tokens = tokens(line);
        if (tokens.isEmpty()) {
          continue;
        }
        String first = tokens.get(0).toLowerCase(Locale.ROOT);
        if (first.endsWith(":")) {
          String value = tokens.size() > 1 ? tokens.get(1).toLowerCase(Locale.ROOT) : "";
          switch (first) {
            case "precision:" -> precision = Integer.parseInt(value);
            case "rounding:" -> rounding = value;
            case "extended:" -> extended = value.equals("1");
            default -> { } // version, exponent limits, clamp: their effects show in the conditions
          }
          continue;
        }
        int arrow = tokens.indexOf("->");
        if (arrow < 2 || arrow + 1 >= tokens.size()) {
          continue;
        }
        cases.add(new Case(name, tokens.get(0), tokens.get(1).toLowerCase(Locale.ROOT), tokens.subList(2, arrow),
            tokens.get(arrow + 1), tokens.subList(arrow + 2, tokens.size()), precision, rounding, extended));
      }
    }
    return cases;
  }

  /** White-space separated tokens; quotes (' or ") group, a doubled quote is one; "--" starts a comment. */
  private static List<String> tokens(String line) {
    List<String> out = new ArrayList<>();
    int i = 0;
    while (i < line.length()) {
      char c = line.charAt(i);
      if (Character.isWhitespace(c)) {
        i++;
      } else if (line.startsWith("--", i)) {
        break;
      } else if (c == '\'' || c == '"') {
        StringBuilder sb = new StringBuilder();
        i++;
        while (i < line.length()) {
          if (line.charAt(i) == c) {
            if (i + 1 < line.length() && line.charAt(i + 1) == c) {
              sb.append(c);
              i += 2;
              continue;
            }
            i++;
            break;
          }
          sb.append(line.charAt(i++));
        }
        out.add(sb.toString());
      } else {
        int j = i;
        while (j < line.length() && !Character.isWhitespace(line.charAt(j))) {
          j++;
        }
        out.add(line.substring(i, j));
        i = j;
      }
    }
    return out;
  }
}
