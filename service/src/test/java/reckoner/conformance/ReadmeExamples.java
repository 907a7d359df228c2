package reckoner.conformance;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The shell examples of the README, read as a test reads them. In a {@code ```sh} block, a command
 * is a line that starts with a program name ({@code curl}, {@code java}, {@code printf}, ...), joined
 * with the lines its trailing backslashes continue; a {@code # ...} remark at the end of a command
 * line is not part of it. The comment lines right under a command are its expected output, one
 * output line per {@code # } line, a line that starts {@code #  } (two spaces) continuing the one
 * before; {@code …} or {@code ...} stands for any text, and a remark after three or more spaces and a
 * parenthesis is left out ({@code # 2.68   (the tie goes to the even digit)} expects {@code 2.68}).
 * The set-up section's commands prepare a machine; CI runs them ({@code .ci/run}), not this reader.
 */
final class ReadmeExamples {
  private ReadmeExamples() {}

  /** One command of the README, the section it stands in, and what it must print (null: no expectation). */
  record Example(String section, int line, String command, String expected) {
    /** Whether {@code output} is what the README shows. */
    boolean matches(String output) {
      return pattern(expected).matcher(output.strip()).matches();
    }

    @Override
    public String toString() {
      return section + " (README line " + line + "): " + (command.length() > 90 ? command.substring(0, 87) + "..." : command);
    }
  }

  private static final Pattern REMARK = Pattern.compile("\\s{3,}\\(.*$");

  /** Every example of the README's {@code sh} blocks, in order. */
  static List<Example> read() throws IOException {
    List<String> lines = Files.readAllLines(JarServer.projectDir().resolve("README.md"), StandardCharsets.UTF_8);
    List<Example> examples = new ArrayList<>();
    String section = "";
    boolean inBlock = false;
    for (int i = 0; i < lines.size(); i++) {
      String line = lines.get(i);
      if (!inBlock && line.startsWith("## ")) {
        section = line.substring(3).trim();
      }
      if (line.startsWith("```")) {
        inBlock = !inBlock && line.trim().equals("```sh");
        continue;
      }
      if (!inBlock || line.isBlank() || line.startsWith("#")) {
        continue;
      }
      int start = i;
      StringBuilder command = new StringBuilder();
      String current = line;
      while (current.endsWith("\\") && i + 1 < lines.size()) {
        command.append(current, 0, current.length() - 1).append(' ');
        current = lines.get(++i).trim();
      }
      command.append(stripRemark(current));
      StringBuilder expected = null;
      while (i + 1 < lines.size() && lines.get(i + 1).startsWith("#")) {
        String c = lines.get(++i);
        String text = c.substring(1).strip();
        if (expected == null) {
          expected = new StringBuilder(REMARK.matcher(text).replaceFirst(""));
        } else if (c.startsWith("#  ")) {
          expected.append(text);
        } else {
          expected.append('\n').append(REMARK.matcher(text).replaceFirst(""));
        }
      }
      if (!section.startsWith("Set-up")) {
        examples.add(new Example(section, start + 1, command.toString().strip(), expected == null ? null : expected.toString()));
      }
    }
    return examples;
  }

  /** A command line without its trailing remark ({@code curl ... # what it shows}), quotes respected. */
  private static String stripRemark(String line) {
    boolean single = false;
    boolean dbl = false;
    for (int i = 0; i < line.length(); i++) {
      char c = line.charAt(i);
      if (c == '\'' && !dbl) {
        single = !single;
      } else if (c == '"' && !single) {
        dbl = !dbl;
      } else if (c == '#' && !single && !dbl && i > 0 && Character.isWhitespace(line.charAt(i - 1))) {
        return line.substring(0, i).strip();
      }
    }
    return line;
  }

  /** The expectation as a pattern: its text literally, {@code …} and {@code ...} as any text. */
  static Pattern pattern(String expected) {
    StringBuilder regex = new StringBuilder();
    for (String part : expected.split("…|\\.\\.\\.", -1)) {
      if (regex.length() > 0) {
        regex.append(".*?");
      }
      regex.append(Pattern.quote(part));
    }
    return Pattern.compile(regex.toString(), Pattern.DOTALL);
  }
}
