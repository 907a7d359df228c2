package reckoner.data;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * A dataset's content digest, its {@code data_version}: SHA-256 over a sequence of fields, each
 * its UTF-8 length as 4 bytes big-endian and then its bytes, an absent field the length
 * {@code FF FF FF FF} with no bytes, so that no two different field sequences give the same
 * bytes. Shown as {@code sha256:} and the first 16 hex digits. Single use; not thread-safe.
 */
public final class ContentDigest {
  private final MessageDigest sha256;

  private ContentDigest() {
    try {
      sha256 = MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new AssertionError("every Java platform has SHA-256", e); // Java SE requires it
    }
  }

  /** A digest whose first field is {@code format}, naming the file format and its version. */
  public static ContentDigest of(String format) {
    return new ContentDigest().put(format);
  }

  /** Adds one field; {@code null} is an absent field. Returns this digest. */
  public ContentDigest put(String field) {
    byte[] bytes = field == null ? null : field.getBytes(StandardCharsets.UTF_8);
    int length = bytes == null ? -1 : bytes.length;
    sha256.update((byte) (length >>> 24));
    sha256.update((byte) (length >>> 16));
    sha256.update((byte) (length >>> 8));
    sha256.update((byte) length);
    if (bytes != null) {
      sha256.update(bytes);
    }
    return this;
  }

  /** {@code sha256:} and the first 16 hex digits of the digest; ends this digest's use. */
  public String version() {
    return "sha256:" + HexFormat.of().formatHex(sha256.digest(), 0, 8);
  }
}
