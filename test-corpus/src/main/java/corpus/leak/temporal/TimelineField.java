package corpus.leak.temporal;

import java.io.File;
import java.io.IOException;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** The time-ordered rows are kept in a field and shuffled in another method before the split. */
class TimelineField {
  private DataSet timeline;
  private DataSet gallery;

  void load(File folder, DataSet images) throws IOException, InterruptedException {
    timeline = SequenceReaders.traces(folder).next();
    gallery = images;
  }

  SplitTestAndTrain prepare() {
    timeline.shuffle(21); // expect: leak.temporal-shuffle
    return timeline.splitTestAndTrain(0.8);
  }

  SplitTestAndTrain prepareGallery() {
    gallery.shuffle(21); // clean: leak.temporal-shuffle
    return gallery.splitTestAndTrain(0.8);
  }
}
