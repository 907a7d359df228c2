package reckoner.access;

/** The keys file cannot be used: which file, which line (0: the file as a whole) and why. Never quotes a secret. */
public final class KeysFileException extends Exception {
  private static final long serialVersionUID = 1L;
  private final int line;

  KeysFileException(String file, int line, String reason) {
    super(file + (line > 0 ? ", line " + line : "") + ": " + reason);
    this.line = line;
  }

  public int line() {
    return line;
  }
}
