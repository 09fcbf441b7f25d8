package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.expr.MethodCallExpr;
import dev.plumbline.analysis.shape.ShapeFacts.WidthKind;
import dev.plumbline.model.ApiMethod;
import java.util.ArrayList;
import java.util.List;

/**
 * Transfer of DL4J network configuration chains and of training and prediction calls. The
 * width rules were measured on deeplearning4j-nn 1.0.0-M2.1 ({@code NetworkWidthsTest} in
 * {@code library-checks}):
 * <ul>
 *   <li>In a {@code list()} configuration DL4J replaces every layer's written {@code nIn} with
 *       the previous layer's {@code nOut} when it builds (unless {@code overrideNinUponBuild(false)}),
 *       so a disagreement there is no run-time error.
 *   <li>In a {@code graphBuilder()} graph, written widths are kept: a layer whose {@code nIn}
 *       differs from the {@code nOut} of its one input fails at the first forward pass.
 *   <li>Features whose width differs from the first layer's {@code nIn}, and labels whose width
 *       differs from the output layer's {@code nOut}, fail in {@code fit}/{@code output}.
 *   <li>With {@code setInputType} DL4J derives widths itself; nothing is claimed then.
 * </ul>
 */
final class NetworkTransfer {
  private final ShapeEvaluator ev;
  private final TensorTransfer tensors;

  NetworkTransfer(ShapeEvaluator ev, TensorTransfer tensors) {
    this.ev = ev;
    this.tensors = tensors;
  }

  ShapeValue call(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args) {
    switch (m.effect()) {
      case BUILD:
        if (receiver instanceof NetworkValue n) {
          checkWidths(n);
        }
        return receiver instanceof NetworkValue || receiver instanceof NetworkValue.Layer ? receiver : null;
      case ADD_LAYER:
        return addLayer(call, m, receiver, args);
      case LAYER_STACK:
        return NetworkValue.empty(m.flag("graph"));
      case TRAIN:
      case PREDICT:
        return model(call, m, receiver, args);
      default:
        return configure(call, m, receiver, args);
    }
  }

  /** {@code new MultiLayerNetwork(configuration)}: the network has the configuration's widths. */
  ShapeValue construct(ApiMethod ctor, List<ShapeValue> args) {
    int at = ctor.intAttribute("configArg", 0);
    return at < args.size() && args.get(at) instanceof NetworkValue n ? n : TensorTransfer.NOT_HANDLED;
  }

  /**
   * A setter on a layer builder or network configuration: attribute {@code width} (in, out) sets
   * a layer's {@code nIn}/{@code nOut}; attribute {@code network} (inputType, overrideNin) records
   * how DL4J will treat the widths; any other setter returns the configuration unchanged.
   */
  ShapeValue configure(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args) {
    String width = String.valueOf(m.attribute("width"));
    if (receiver instanceof NetworkValue.Layer layer) {
      Dim size = !args.isEmpty() && args.get(0) instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN;
      return switch (width) {
        case "in" -> layer.withNIn(size);
        case "out" -> layer.withNOut(size);
        default -> layer;
      };
    }
    if (receiver instanceof NetworkValue n) {
      return switch (String.valueOf(m.attribute("network"))) {
        case "inputType" -> n.withInputType();
        case "overrideNin" -> n.withOverrideNin(!call.getArguments().isEmpty() && call.getArgument(0).isBooleanLiteralExpr()
            ? Truth.of(call.getArgument(0).asBooleanLiteralExpr().getValue()) : Truth.UNKNOWN);
        default -> n;
      };
    }
    return null;
  }

  private ShapeValue addLayer(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args) {
    if (!(receiver instanceof NetworkValue n)) {
      return null;
    }
    int indexArg = m.intAttribute("indexArg", -1);
    if (indexArg >= 0) {
      Integer index = TensorTransfer.constant(args, indexArg);
      if (index == null || index != n.layers().size()) {
        return null; // layers placed out of order: give up on this configuration
      }
    }
    int layerArg = m.intAttribute("layerArg", 0);
    NetworkValue.Layer layer = layerArg < args.size() && args.get(layerArg) instanceof NetworkValue.Layer l ? l : null;
    String name = literal(call, m.intAttribute("nameArg", -1));
    List<String> inputs = new ArrayList<>();
    int inputsArg = m.intAttribute("inputsArg", -1);
    if (inputsArg >= 0) {
      for (int i = inputsArg; i < call.getArguments().size(); i++) {
        String input = literal(call, i);
        if (input == null) {
          inputs.clear();
          break;
        }
        inputs.add(input);
      }
    }
    return n.adding(new NetworkValue.Entry(name, layer, inputs, Site.of(call)));
  }

  private static String literal(MethodCallExpr call, int i) {
    if (i < 0 || i >= call.getArguments().size() || !call.getArgument(i).isStringLiteralExpr()) {
      return null;
    }
    return call.getArgument(i).asStringLiteralExpr().asString();
  }

  /** At {@code build()}: the widths DL4J will keep and that disagree. */
  private void checkWidths(NetworkValue n) {
    if (ev.sink == null || n.inputTypeSet()) {
      return;
    }
    if (n.graph()) {
      for (NetworkValue.Entry e : n.layers()) {
        if (e.layer() == null || e.inputs().size() != 1) {
          continue;
        }
        NetworkValue.Entry from = n.named(e.inputs().get(0));
        if (from != null && from.layer() != null && chained(from.layer(), e.layer())
            && from.layer().nOut().equalTo(e.layer().nIn()).isFalse()) {
          widthMismatch(e.call().node(), WidthKind.LAYER_INPUT, from.layer().nOut(), e.layer().nIn(),
              from.call().node(), null);
        }
      }
    } else if (n.overrideNin().isFalse()) {
      for (int i = 1; i < n.layers().size(); i++) {
        NetworkValue.Layer prev = n.layers().get(i - 1).layer();
        NetworkValue.Layer next = n.layers().get(i).layer();
        if (prev != null && next != null && chained(prev, next) && prev.nOut().equalTo(next.nIn()).isFalse()) {
          widthMismatch(n.layers().get(i).call().node(), WidthKind.LIST_LAYER_INPUT, prev.nOut(), next.nIn(),
              n.layers().get(i - 1).call().node(), null);
        }
      }
    }
  }

  /** Layers of one family pass their width on unchanged: dense into dense or output, LSTM into RNN output. */
  private static boolean chained(NetworkValue.Layer from, NetworkValue.Layer to) {
    return family(from.kind()) != null && family(from.kind()).equals(family(to.kind()));
  }

  private static String family(String kind) {
    if (kind == null) {
      return null;
    }
    return switch (kind) {
      case "dense", "output" -> "feed-forward";
      case "lstm", "rnn-output" -> "recurrent";
      default -> null;
    };
  }

  private static boolean isOutput(String kind) {
    return "output".equals(kind) || "rnn-output".equals(kind);
  }

  /** {@code fit(features, labels)} and {@code output(features)} on a network whose widths we know. */
  private ShapeValue model(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args) {
    int dataArg = m.intAttribute("dataArg", 0);
    ShapeValue.Tensor features = dataArg < args.size() && args.get(dataArg) instanceof ShapeValue.Tensor t ? t : null;
    if (features != null) {
      tensors.recordUse(call, List.of(features));
    }
    if (!(receiver instanceof NetworkValue n) || n.graph() || n.inputTypeSet() || n.layers().isEmpty()
        || features == null) {
      return m.effect() == dev.plumbline.model.Effect.PREDICT ? ev.unknownResult(call) : null;
    }
    NetworkValue.Layer first = n.layers().get(0).layer();
    NetworkValue.Layer last = n.layers().get(n.layers().size() - 1).layer();
    if (first != null && family(first.kind()) != null) {
      int rank = family(first.kind()).equals("feed-forward") ? 2 : 3;
      if (features.shape().rank() == rank && features.shape().dim(1).equalTo(first.nIn()).isFalse()) {
        widthMismatch(call, WidthKind.FEATURES, first.nIn(), features.shape().dim(1), first.site().node(),
            features.shape());
      }
    }
    int labelsArg = m.intAttribute("labelsArg", -1);
    if (labelsArg >= 0 && labelsArg < args.size() && args.get(labelsArg) instanceof ShapeValue.Tensor labels
        && last != null && isOutput(last.kind())) {
      tensors.recordUse(call, List.of(labels));
      int rank = family(last.kind()).equals("feed-forward") ? 2 : 3;
      if (labels.shape().rank() == rank && labels.shape().dim(1).equalTo(last.nOut()).isFalse()) {
        widthMismatch(call, WidthKind.LABELS, last.nOut(), labels.shape().dim(1), last.site().node(), labels.shape());
      }
    }
    if (m.effect() != dev.plumbline.model.Effect.PREDICT) {
      return null;
    }
    ev.state = ev.state.forget(Site.of(call));
    Framework fw = Framework.ND4J;
    if (last != null && isOutput(last.kind()) && features.shape().rankKnown()) {
      List<Dim> out = new ArrayList<>();
      out.add(features.shape().dim(0));
      out.add(last.nOut());
      if (features.shape().rank() == 3 && family(last.kind()).equals("recurrent")) {
        out.add(features.shape().dim(2));
      }
      if (out.size() == features.shape().rank()) {
        return ShapeValue.Tensor.of(TensorShape.of(out), fw, Site.of(call));
      }
    }
    return ShapeValue.Tensor.of(TensorShape.unknown(), fw, Site.of(call));
  }

  private void widthMismatch(Node at, WidthKind kind, Dim expected, Dim actual, Node related, TensorShape shape) {
    if (ev.sink == null) {
      return;
    }
    Node inFile = related != null && sameUnit(related, at) ? related : null;
    ev.sink.add(new ShapeFacts.WidthMismatch(ev.analysis.graph, at, kind, expected, actual, inFile, shape));
  }

  private static boolean sameUnit(Node a, Node b) {
    return a.findCompilationUnit().orElse(null) == b.findCompilationUnit().orElse(null);
  }
}
