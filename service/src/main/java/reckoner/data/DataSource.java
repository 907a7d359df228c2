package reckoner.data;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * Where data files come from: a directory of {@code *.jsonl} files, or a fixed list of classpath
 * resources (demo data shipped in the jar). Files load in a fixed order: sources in the order
 * given, and within a directory by file name (code-unit order, the same on every machine); names
 * starting with {@code .} are skipped, so editors' and copy tools' temporary files never load.
 * Immutable.
 */
public abstract class DataSource {
  /** One file to read: its name for reports, and how to open it (bytes; the reader decodes UTF-8 per line). */
  public interface Input {
    String name();

    InputStream open() throws IOException;
  }

  private DataSource() {}

  /** The {@code *.jsonl} files directly inside {@code dir} (not its subfolders). */
  public static DataSource directory(Path dir) {
    return new Directory(Objects.requireNonNull(dir, "dir"));
  }

  /** One directory source per path, in order. */
  public static List<DataSource> directories(List<Path> dirs) {
    return dirs.stream().map(DataSource::directory).toList();
  }

  /** Classpath resources {@code folder + name} for each name, in order. */
  public static DataSource resources(ClassLoader loader, String folder, List<String> names) {
    return new Resources(Objects.requireNonNull(loader, "loader"), folder, List.copyOf(names));
  }

  /** The files to read, in load order. */
  public abstract List<Input> inputs() throws IOException;

  /**
   * A value that changes when the files change (names, sizes, modification times), cheap enough
   * to compute every few seconds.
   */
  abstract Object fingerprint();

  private static final class Directory extends DataSource {
    private final Path dir;

    Directory(Path dir) {
      this.dir = dir;
    }

    @Override
    public List<Input> inputs() throws IOException {
      List<Input> inputs = new ArrayList<>();
      for (Path file : files()) {
        inputs.add(new Input() {
          @Override
          public String name() {
            return file.toString();
          }

          @Override
          public InputStream open() throws IOException {
            return Files.newInputStream(file);
          }
        });
      }
      return inputs;
    }

    private List<Path> files() throws IOException {
      if (!Files.isDirectory(dir)) {
        throw new IOException("not a readable directory");
      }
      try (Stream<Path> listing = Files.list(dir)) {
        return listing
            .filter(p -> {
              String name = p.getFileName().toString();
              return name.endsWith(".jsonl") && !name.startsWith(".") && Files.isRegularFile(p);
            })
            .sorted(Comparator.comparing(p -> p.getFileName().toString()))
            .toList();
      }
    }

    @Override
    Object fingerprint() {
      List<Object> parts = new ArrayList<>();
      try {
        for (Path file : files()) {
          BasicFileAttributes a = Files.readAttributes(file, BasicFileAttributes.class);
          parts.add(List.of(file.getFileName().toString(), a.size(), a.lastModifiedTime().to(TimeUnit.NANOSECONDS),
              String.valueOf(a.fileKey())));
        }
      } catch (IOException e) {
        parts.add("unreadable: " + e.getMessage());
      }
      return parts;
    }

    @Override
    public String toString() {
      return dir.toString();
    }
  }

  private static final class Resources extends DataSource {
    private final ClassLoader loader;
    private final String folder;
    private final List<String> names;

    Resources(ClassLoader loader, String folder, List<String> names) {
      this.loader = loader;
      this.folder = folder;
      this.names = names;
    }

    @Override
    public List<Input> inputs() {
      List<Input> inputs = new ArrayList<>();
      for (String name : names) {
        String resource = folder + name;
        inputs.add(new Input() {
          @Override
          public String name() {
            return "classpath:" + resource;
          }

          @Override
          public InputStream open() throws IOException {
            InputStream in = loader.getResourceAsStream(resource);
            if (in == null) {
              throw new IOException("no such classpath resource");
            }
            return in;
          }
        });
      }
      return inputs;
    }

    @Override
    Object fingerprint() {
      return List.of("classpath", folder, names); // the jar does not change under a running service
    }

    @Override
    public String toString() {
      return "classpath:" + folder;
    }
  }
}
