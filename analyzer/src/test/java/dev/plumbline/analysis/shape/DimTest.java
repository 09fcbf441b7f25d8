package dev.plumbline.analysis.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

/** Symbolic sizes: products, exact division, and three-valued comparison. */
class DimTest {
  private final Symbol b = Symbol.named("b");
  private final Symbol c = Symbol.named("c");

  @Test
  void productsAndQuotientsOfMonomials() {
    Dim count = Dim.of(b).times(Dim.of(16));
    assertEquals("16*b", count.toString());
    assertEquals(Dim.of(b).times(Dim.of(2)), count.exactQuotient(Dim.of(8)).orElseThrow());
    assertEquals(Dim.of(16), count.exactQuotient(Dim.of(b)).orElseThrow());
    assertTrue(count.exactQuotient(Dim.of(c)).isEmpty());
    assertTrue(Dim.of(30).exactQuotient(Dim.of(4)).isEmpty());
    assertEquals(Truth.FALSE, Dim.of(30).divisibleBy(Dim.of(4)));
    assertEquals(Truth.UNKNOWN, count.divisibleBy(Dim.of(c)));
    assertEquals(Long.valueOf(48), count.evaluate(Map.of(b, 3L)));
  }

  @Test
  void comparisonsAreCertainOnlyWhenTheSizesSayItWhateverTheSymbolIs() {
    assertEquals(Truth.TRUE, Dim.of(b).equalTo(Dim.of(b)));
    assertEquals(Truth.UNKNOWN, Dim.of(b).equalTo(Dim.of(c)));
    assertEquals(Truth.UNKNOWN, Dim.of(b).equalTo(Dim.of(16)));
    assertEquals(Truth.FALSE, Dim.of(16).equalTo(Dim.of(8)));
    assertEquals(Truth.FALSE, Dim.of(b).times(Dim.of(2)).equalTo(Dim.of(b)));
    assertEquals(Truth.UNKNOWN, Dim.of(b).isOne());
    assertEquals(Truth.FALSE, Dim.of(b).times(Dim.of(2)).isOne());
    assertEquals(Truth.UNKNOWN, Dim.UNKNOWN.equalTo(Dim.UNKNOWN));
    assertFalse(Dim.UNKNOWN.known());
  }

  @Test
  void sumsKeepOnlyLikeTerms() {
    assertEquals(Dim.of(b).times(Dim.of(2)), Dim.of(b).plus(Dim.of(b)));
    assertFalse(Dim.of(b).plus(Dim.of(c)).known());
    assertEquals(Dim.of(7), Dim.of(3).plus(Dim.of(4)));
  }

  @Test
  void shapesJoinAxisByAxis() {
    TensorShape x = TensorShape.of(Dim.of(b), Dim.of(16));
    TensorShape y = TensorShape.of(Dim.of(b), Dim.of(8));
    assertEquals("[b, ?]", x.join(y).toString());
    assertEquals("[b, ...]", x.join(TensorShape.of(Dim.of(b))).toString());
    assertEquals("[...]", TensorShape.unknown().toString());
    assertEquals("[?, 16, ...]", TensorShape.unknown().withDim(1, Dim.of(16)).toString());
    assertEquals("[?, 16]", TensorShape.unknown().withDim(1, Dim.of(16)).withRank(2).toString());
  }
}
