package reckoner.config;

/** A setting that cannot be used; the message names it and says what is allowed. */
public final class ConfigException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public ConfigException(String message) {
    super(message);
  }
}
