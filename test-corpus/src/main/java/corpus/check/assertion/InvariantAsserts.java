package corpus.check.assertion;

import java.util.List;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Asserts that are fine: internal invariants, private preconditions, facts already enforced. */
public class InvariantAsserts {
  private boolean initialized;

  public int countBatches(List<INDArray> batches) {
    int seen = 0;
    for (INDArray b : batches) {
      seen++;
    }
    int total = seen;
    assert seen <= total; // clean: check.assert-validation
    return seen;
  }

  private void step(int index) {
    assert index >= 0; // clean: check.assert-validation
  }

  private void apply(INDArray update) {
    assert update != null; // clean: check.assert-validation
  }

  public void start() {
    assert !initialized; // clean: check.assert-validation
    initialized = true;
  }

  public INDArray afterRealCheck(INDArray x) {
    if (x.rank() != 2 || x.size(1) != 16) {
      throw new IllegalArgumentException("x must be [n, 16]");
    }
    assert x.size(1) == 16; // clean: check.assert-validation
    return x;
  }

  public INDArray byConstruction() {
    INDArray w = Nd4j.rand(16, 4);
    assert w.size(0) == 16; // clean: check.assert-validation
    return w;
  }

  /** The helper's result has a known width: the assert restates a proven fact. */
  public INDArray fromHelper(int rows) {
    INDArray features = makeFeatures(rows);
    assert features.size(1) == 16; // clean: check.assert-validation
    return features;
  }

  private INDArray makeFeatures(int rows) {
    return Nd4j.zeros(rows, 16);
  }

  public void visit(List<String> names) {
    names.forEach(n -> {
      assert n != null; // clean: check.assert-validation
    });
  }
}
