package dev.plumbline.analysis.entrypoints;

import dev.plumbline.finding.Location;
import java.util.List;
import java.util.OptionalLong;

/**
 * An evaluation call: where a model is scored, on what data, and how many rows that data holds
 * when the code fixes it. Holds no syntax tree.
 *
 * @param location the evaluation call
 * @param call the call as written, shortened
 * @param method the library method, e.g. {@code MultiLayerNetwork.evaluate(DataSetIterator)}
 * @param data the data argument as written, shortened
 * @param roles which rows the data may hold, from the provenance analysis ({@code TEST},
 *     {@code WHOLE}, ...), empty when unknown
 * @param dataSources where those rows entered the method and where they were split
 * @param rows number of rows evaluated on, when statically known
 * @param measuresAccuracy whether the call returns a classification evaluation, so that an
 *     accuracy read from it is a proportion of the rows
 */
public record Evaluation(Location location, String call, String method, String data,
    List<String> roles, List<Location> dataSources, OptionalLong rows, boolean measuresAccuracy) {

  public Evaluation {
    roles = List.copyOf(roles);
    dataSources = List.copyOf(dataSources);
  }
}
