package dev.plumbline.parse;

import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;

/**
 * Decodes source bytes the way {@code javac -encoding UTF-8} reads them, minus the failure:
 * a UTF-8 byte-order mark is dropped, and bytes that are not UTF-8 become U+FFFD so the rest of
 * the file is still analyzed (the caller reports that the file was not valid UTF-8).
 */
public record SourceText(String text, boolean hadInvalidBytes) {
  private static final byte[] BOM = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};

  public static SourceText decode(byte[] bytes) {
    int offset = startsWithBom(bytes) ? BOM.length : 0;
    ByteBuffer buffer = ByteBuffer.wrap(bytes, offset, bytes.length - offset);
    CharsetDecoder strict = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT)
        .onUnmappableCharacter(CodingErrorAction.REPORT);
    try {
      return new SourceText(strict.decode(buffer).toString(), false);
    } catch (CharacterCodingException e) {
      String lenient = new String(bytes, offset, bytes.length - offset, StandardCharsets.UTF_8);
      return new SourceText(lenient, true);
    }
  }

  private static boolean startsWithBom(byte[] bytes) {
    return bytes.length >= 3 && bytes[0] == BOM[0] && bytes[1] == BOM[1] && bytes[2] == BOM[2];
  }
}
