package reckoner.io;

import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;

/** Strict UTF-8 (RFC 3629), for input read as bytes before a lenient reader sees it. */
public final class Utf8 {
  private Utf8() {}

  /**
   * Whether {@code bytes} are well-formed UTF-8: no invalid bytes, truncated sequences, encoded
   * surrogates, or overlong forms such as {@code C0 AF} for {@code /}, which a lenient JSON reader
   * takes for the character. ASCII, the common case, is one pass.
   */
  public static boolean isWellFormed(byte[] bytes) {
    for (byte b : bytes) {
      if (b < 0) {
        try {
          StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
              .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes));
          return true;
        } catch (CharacterCodingException e) {
          return false;
        }
      }
    }
    return true;
  }
}
