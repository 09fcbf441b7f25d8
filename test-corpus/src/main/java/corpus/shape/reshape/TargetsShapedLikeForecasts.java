package corpus.shape.reshape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.types.Shape;
import org.nd4j.linalg.api.ndarray.INDArray;

/**
 * Errors of a district water-demand forecast: the observed demand is laid out as the forecast
 * is before the two are compared. A reshape to another array's whole shape copies that array's
 * layout; it is not a size someone computed.
 */
class TargetsShapedLikeForecasts {
  NDArray squaredError(NDArray forecast, NDArray observed) {
    NDArray aligned = observed.reshape(forecast.getShape()); // clean: shape.unchecked-reshape
    NDArray error = forecast.sub(aligned);
    return error.mul(error).mean();
  }

  INDArray absoluteError(INDArray forecast, INDArray observed) {
    INDArray aligned = observed.reshape(forecast.shape()); // clean: shape.unchecked-reshape
    return forecast.sub(aligned);
  }

  /** Only the leading size is copied; how the rest is split is still the author's arithmetic. */
  NDArray errorPerDistrict(NDArray forecast, NDArray observed) {
    NDArray regrouped = observed.reshape(forecast.getShape().get(0), -1); // expect: shape.unchecked-reshape
    return forecast.sub(regrouped);
  }

  /** The copied sizes are edited before use: computed again. */
  INDArray errorOfWeeks(INDArray forecast, INDArray observed, long weeks) {
    long[] layout = forecast.shape();
    layout[0] = weeks;
    INDArray regrouped = observed.reshape(layout); // expect: shape.unchecked-reshape
    return forecast.sub(regrouped);
  }

  /** A DJL shape built from two computed sizes is still computed. */
  NDArray errorOfHours(NDArray forecast, NDArray observed, long days, long hours) {
    NDArray hourly = observed.reshape(new Shape(days, hours)); // expect: shape.unchecked-reshape
    return forecast.sub(hourly);
  }
}
