package reckoner.access;

import java.util.Optional;

/** What a key may do. Scopes are independent, except that {@link #ADMIN} reads every key's records. */
public enum Scope {
  /** Run tools: invoke, batch, splice, fill. */
  INVOKE("invoke"),
  /** Read the ledger: the key's own records. */
  LEDGER_READ("ledger:read"),
  /** Operate the service: reloads, the key list, the status page, and every key's records. */
  ADMIN("admin");

  private final String wireName;

  Scope(String wireName) {
    this.wireName = wireName;
  }

  /** The scope as the keys file and error messages write it, e.g. {@code ledger:read}. */
  public String wireName() {
    return wireName;
  }

  public static Optional<Scope> parse(String wire) {
    for (Scope s : values()) {
      if (s.wireName.equals(wire)) {
        return Optional.of(s);
      }
    }
    return Optional.empty();
  }

  @Override
  public String toString() {
    return wireName;
  }
}
