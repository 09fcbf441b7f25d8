package dev.plumbline.engine;

import com.github.javaparser.ast.Node;
import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Message;
import dev.plumbline.finding.Severity;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Where rules report. A report names the harmful node; the engine turns it into a located,
 * fingerprinted {@link dev.plumbline.finding.Finding}.
 */
public interface FindingReporter {

  void report(Report report);

  /** Starts a report of {@code rule} at {@code node}. */
  default Report.Builder at(Rule rule, Node node) {
    return new Report.Builder(this, rule.descriptor(), node);
  }

  /** What a rule says about one defect, before locations and fingerprints are computed. */
  record Report(
      RuleDescriptor rule,
      Node node,
      Message message,
      List<Related> related,
      Message fixHint,
      Optional<Severity> severity,
      Optional<Edit> fix,
      List<Message> involved) {

    /** A related place given as a node of the same file. */
    public record Related(Node node, Message message) {}

    /** Fluent construction: {@code reporter.at(this, call).message(...).fix(...).emit()}. */
    public static final class Builder {
      private final FindingReporter sink;
      private final RuleDescriptor rule;
      private final Node node;
      private Message message;
      private final List<Related> related = new ArrayList<>();
      private Message fixHint;
      private Severity severity;
      private Edit fix;
      private final List<Message> involved = new ArrayList<>();

      Builder(FindingReporter sink, RuleDescriptor rule, Node node) {
        this.sink = sink;
        this.rule = rule;
        this.node = node;
      }

      /** Message key {@code <rule id>.<variant>} or the rule id itself; arguments as typed in the bundle. */
      public Builder message(String key, Object... args) {
        this.message = Message.of(key, args);
        return this;
      }

      public Builder related(Node at, String key, Object... args) {
        if (at != null) {
          related.add(new Related(at, Message.of(key, args)));
        }
        return this;
      }

      public Builder fix(String key, Object... args) {
        this.fixHint = Message.of(key, args);
        return this;
      }

      /** Overrides the default severity, e.g. a weaker one when the analysis is less sure. */
      public Builder severity(Severity s) {
        this.severity = s;
        return this;
      }

      /**
       * What the analysis inferred about a value involved, for reports to show beside the
       * message: key {@code involved.data-role} (expression, roles) or {@code involved.shape}
       * (expression, shape), or another {@code involved.*} key of the bundle.
       */
      public Builder involves(String key, Object... args) {
        involved.add(Message.of(key, args));
        return this;
      }

      public Builder edit(Edit e) {
        this.fix = e;
        return this;
      }

      public void emit() {
        if (message == null) {
          throw new IllegalStateException("report of " + rule.id() + " has no message");
        }
        Message hint = fixHint != null ? fixHint : Message.of("rule." + rule.id() + ".fix");
        sink.report(new Report(rule, node, message, related, hint, Optional.ofNullable(severity),
            Optional.ofNullable(fix), List.copyOf(involved)));
      }
    }
  }
}
