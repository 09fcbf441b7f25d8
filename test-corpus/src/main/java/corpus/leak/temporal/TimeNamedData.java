package corpus.leak.temporal;

import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Data whose names say it is ordered in time (hourly readings, daily totals). */
class TimeNamedData {
  SplitTestAndTrain shuffledHours(DataSet hourlyReadings) {
    hourlyReadings.shuffle(3); // expect: leak.temporal-shuffle
    return hourlyReadings.splitTestAndTrain(0.9);
  }

  SplitTestAndTrain randomlySplitDays(DataSet dailyTotals) {
    return dailyTotals.splitTestAndTrain(200, new Random(8)); // expect: leak.temporal-shuffle
  }

  DataSet shuffledWindows(DataSet hourlyReadings) {
    List<DataSet> windows = hourlyReadings.asList();
    Collections.shuffle(windows, new Random(4)); // expect: leak.temporal-shuffle
    DataSet merged = DataSet.merge(windows);
    return merged.splitTestAndTrain(0.8).getTest();
  }

  SplitTestAndTrain orderedSplit(DataSet hourlyReadings) {
    return hourlyReadings.splitTestAndTrain(0.9); // clean: leak.temporal-shuffle
  }

  SplitTestAndTrain shuffledPhotos(DataSet photos) {
    photos.shuffle(3); // clean: leak.temporal-shuffle
    return photos.splitTestAndTrain(0.9);
  }

  SplitTestAndTrain shuffledRuntimeMetrics(DataSet runtimeMetrics) {
    runtimeMetrics.shuffle(3); // clean: leak.temporal-shuffle
    return runtimeMetrics.splitTestAndTrain(0.9);
  }

  void shuffledButNeverSplit(DataSet hourlyReadings) {
    hourlyReadings.shuffle(3); // clean: leak.temporal-shuffle
  }
}
