package reckoner.ledger;

/**
 * A call's record was not written because another record of the same API key already holds its
 * idempotency key: a retry that raced its first attempt (on another replica). Its caller should be
 * given the other record's answer. Carries the key and the idempotency key to look it up by.
 */
public final class SupersededException extends RuntimeException {
  private static final long serialVersionUID = 1L;
  private final String keyId;
  private final String idempotencyKey;

  public SupersededException(String keyId, String idempotencyKey) {
    super("another record holds this call's idempotency key", null, false, false);
    this.keyId = keyId;
    this.idempotencyKey = idempotencyKey;
  }

  public String keyId() {
    return keyId;
  }

  public String idempotencyKey() {
    return idempotencyKey;
  }
}
