package dev.plumbline.report;

import com.contrastsecurity.sarif.ArtifactChange;
import com.contrastsecurity.sarif.ArtifactContent;
import com.contrastsecurity.sarif.ArtifactLocation;
import com.contrastsecurity.sarif.Fix;
import com.contrastsecurity.sarif.Invocation;
import com.contrastsecurity.sarif.Location;
import com.contrastsecurity.sarif.Message;
import com.contrastsecurity.sarif.MultiformatMessageString;
import com.contrastsecurity.sarif.OriginalUriBaseIds;
import com.contrastsecurity.sarif.PartialFingerprints;
import com.contrastsecurity.sarif.PhysicalLocation;
import com.contrastsecurity.sarif.PropertyBag;
import com.contrastsecurity.sarif.Region;
import com.contrastsecurity.sarif.Replacement;
import com.contrastsecurity.sarif.ReportingConfiguration;
import com.contrastsecurity.sarif.ReportingDescriptor;
import com.contrastsecurity.sarif.ReportingDescriptorReference;
import com.contrastsecurity.sarif.Result;
import com.contrastsecurity.sarif.Run;
import com.contrastsecurity.sarif.SarifSchema210;
import com.contrastsecurity.sarif.Suppression;
import com.contrastsecurity.sarif.Tool;
import com.contrastsecurity.sarif.ToolComponent;
import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Notification;
import dev.plumbline.finding.RelatedLocation;
import dev.plumbline.finding.SourceRange;
import java.net.URI;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * SARIF 2.1.0 output built with the SARIF Java model library (com.contrastsecurity:java-sarif).
 *
 * <p>Choices made for code-scanning ingestion: every location's {@code artifactLocation.uri} is
 * relative to {@code %SRCROOT%}, declared in {@code originalUriBaseIds}; every rule carries
 * descriptions and help text; every result has a region with start and end columns and a
 * {@code partialFingerprints} entry; results are capped at {@link #MAX_RESULTS} (GitHub keeps
 * at most 25,000 per run) with a notification when capped. Output holds no timestamps or
 * machine-specific values besides the base URI, so two runs give the same bytes.
 */
public final class SarifReport {
  public static final String SCHEMA_URI = "https://json.schemastore.org/sarif-2.1.0.json";
  public static final String SRCROOT = "%SRCROOT%";
  public static final String FINGERPRINT_KEY = "plumbline/v1";
  public static final int MAX_RESULTS = 25_000;

  private SarifReport() {}

  public static String render(ReportContext ctx) {
    SarifSchema210 log = build(ctx);
    ObjectMapper mapper = new ObjectMapper()
        .setSerializationInclusion(JsonInclude.Include.NON_EMPTY)
        .enable(SerializationFeature.INDENT_OUTPUT)
        .enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS)
        .disable(SerializationFeature.WRITE_DATES_AS_TIMESTAMPS);
    try {
      return mapper.writeValueAsString(log) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("SARIF model failed to serialize", e);
    }
  }

  static SarifSchema210 build(ReportContext ctx) {
    MessageCatalog messages = ctx.messages();
    List<ReportingDescriptor> rules = new ArrayList<>();
    Map<String, Integer> ruleIndex = new HashMap<>();
    for (RuleDescriptor r : ctx.result().rules()) {
      ruleIndex.put(r.id(), rules.size());
      rules.add(ruleDescriptor(r, messages));
    }
    List<Result> results = new ArrayList<>();
    for (Finding f : ctx.result().findings()) {
      if (results.size() >= MAX_RESULTS) {
        break;
      }
      Result r = result(f, ruleIndex.getOrDefault(f.ruleId(), -1), messages, ctx.result());
      if (ctx.baseline().isPresent()) {
        // Known findings were removed; everything left is new relative to the baseline.
        r.withBaselineState(Result.BaselineState.NEW);
      }
      results.add(r);
    }
    List<com.contrastsecurity.sarif.Notification> notes = new ArrayList<>();
    for (Notification n : ctx.result().notifications()) {
      notes.add(notification(n, messages));
    }
    if (ctx.result().findings().size() > MAX_RESULTS) {
      notes.add(new com.contrastsecurity.sarif.Notification()
          .withLevel(com.contrastsecurity.sarif.Notification.Level.WARNING)
          .withMessage(text("Results were capped at " + MAX_RESULTS + " of "
              + ctx.result().findings().size() + ".")));
    }
    Invocation invocation = new Invocation()
        .withExecutionSuccessful(!ctx.result().incomplete())
        .withToolExecutionNotifications(notes);
    ToolComponent driver = new ToolComponent()
        .withName("plumbline")
        .withVersion(ctx.toolVersion())
        .withSemanticVersion(ctx.toolVersion())
        .withRules(new LinkedHashSet<>(rules));
    OriginalUriBaseIds bases = new OriginalUriBaseIds();
    bases.setAdditionalProperty(SRCROOT, new ArtifactLocation()
        .withUri(baseUri(ctx)));
    Run run = new Run()
        .withTool(new Tool().withDriver(driver))
        .withOriginalUriBaseIds(bases)
        .withColumnKind(Run.ColumnKind.UTF_16_CODE_UNITS)
        .withInvocations(List.of(invocation))
        .withResults(results);
    if (ctx.baseline().isPresent()) {
      run.withProperties(runProperties(ctx));
    }
    return new SarifSchema210()
        .with$schema(URI.create(SCHEMA_URI))
        .withVersion(SarifSchema210.Version._2_1_0)
        .withRuns(List.of(run));
  }

  /** Baseline counts, so a reader of the log knows how many accepted findings were left out. */
  private static PropertyBag runProperties(ReportContext ctx) {
    PropertyBag props = new PropertyBag();
    ctx.baseline().ifPresent(b -> {
      Map<String, Object> baseline = new java.util.LinkedHashMap<>();
      baseline.put("file", b.file());
      baseline.put("known", b.known());
      baseline.put("stale", b.stale());
      props.setAdditionalProperty("plumbline/baseline", baseline);
    });
    return props;
  }

  private static String baseUri(ReportContext ctx) {
    String uri = ctx.baseDirectory().toAbsolutePath().normalize().toUri().toString();
    return uri.endsWith("/") ? uri : uri + "/";
  }

  private static ReportingDescriptor ruleDescriptor(RuleDescriptor r, MessageCatalog m) {
    String prefix = "rule." + r.id();
    String full = m.text(prefix + ".full");
    String help = full + "\n\nWhy it matters: " + m.text(prefix + ".why")
        + "\n\nHow to fix: " + m.text(prefix + ".fix");
    String example = m.text(prefix + ".example");
    String markdown = "**" + m.text(prefix + ".short") + "**\n\n" + full
        + "\n\n**Why it matters.** " + m.text(prefix + ".why")
        + "\n\n**How to fix.** " + m.text(prefix + ".fix")
        + (example.isEmpty() ? "" : "\n\n**Example.**\n\n```java\n" + example + "\n```");
    PropertyBag props = new PropertyBag().withTags(new LinkedHashSet<>(r.tags()));
    props.setAdditionalProperty("precision", r.defaultSeverity() == dev.plumbline.finding.Severity.ERROR
        ? "high" : "medium");
    return new ReportingDescriptor()
        .withId(r.id())
        .withName(pascalCase(r.id()))
        .withShortDescription(new MultiformatMessageString().withText(m.text(prefix + ".short")))
        .withFullDescription(new MultiformatMessageString().withText(full))
        .withHelp(new MultiformatMessageString().withText(help).withMarkdown(markdown))
        .withDefaultConfiguration(new ReportingConfiguration()
            .withLevel(ReportingConfiguration.Level.fromValue(r.defaultSeverity().sarifLevel())))
        .withProperties(props);
  }

  /** {@code leak.fit-on-test} becomes {@code LeakFitOnTest}. */
  static String pascalCase(String id) {
    StringBuilder sb = new StringBuilder();
    for (String part : id.split("[.\\-]")) {
      if (!part.isEmpty()) {
        sb.append(Character.toUpperCase(part.charAt(0))).append(part.substring(1));
      }
    }
    return sb.toString();
  }

  private static Result result(Finding f, int index, MessageCatalog m, ScanResult scan) {
    Set<Location> related = new LinkedHashSet<>();
    int id = 1;
    for (RelatedLocation r : f.related()) {
      related.add(location(r.location(), scan).withId(id++).withMessage(text(m.render(r.message()))));
    }
    PartialFingerprints fp = new PartialFingerprints();
    fp.setAdditionalProperty(FINGERPRINT_KEY, f.fingerprint());
    PropertyBag props = new PropertyBag();
    props.setAdditionalProperty("messageKey", f.message().key());
    props.setAdditionalProperty("arguments", f.message().arguments());
    props.setAdditionalProperty("fixHint", m.render(f.fixHint()));
    if (!f.involved().isEmpty()) {
      props.setAdditionalProperty("involved", f.involved().stream().map(m::render).toList());
    }
    Result result = new Result()
        .withRuleId(f.ruleId())
        .withLevel(Result.Level.fromValue(f.severity().sarifLevel()))
        .withMessage(text(m.render(f.message())))
        .withLocations(List.of(location(f.location(), scan)))
        .withRelatedLocations(related)
        .withPartialFingerprints(fp)
        .withProperties(props);
    if (index >= 0) {
      result.withRuleIndex(index);
    }
    f.fix().ifPresent(e -> result.withFixes(Set.of(fix(f, e, m))));
    f.suppression().ifPresent(reason -> result.withSuppressions(Set.of(new Suppression()
        .withKind(Suppression.Kind.IN_SOURCE)
        .withStatus(Suppression.Status.ACCEPTED)
        .withJustification(reason))));
    return result;
  }

  private static Fix fix(Finding f, Edit edit, MessageCatalog m) {
    List<Replacement> replacements = new ArrayList<>();
    for (Edit.Replacement r : edit.replacements()) {
      replacements.add(new Replacement()
          .withDeletedRegion(new Region()
              .withStartLine(r.startLine())
              .withStartColumn(r.startColumn())
              .withEndLine(r.endLine())
              .withEndColumn(r.endColumn()))
          .withInsertedContent(new ArtifactContent().withText(r.text())));
    }
    PropertyBag props = new PropertyBag();
    props.setAdditionalProperty("safe", edit.safe());
    return new Fix()
        .withDescription(text(m.render(edit.description())))
        .withArtifactChanges(Set.of(new ArtifactChange()
            .withArtifactLocation(artifact(f.location().uri()))
            .withReplacements(replacements)))
        .withProperties(props);
  }

  private static com.contrastsecurity.sarif.Notification notification(Notification n, MessageCatalog m) {
    com.contrastsecurity.sarif.Notification out = new com.contrastsecurity.sarif.Notification()
        .withLevel(com.contrastsecurity.sarif.Notification.Level.fromValue(n.level().sarifLevel()))
        .withMessage(text(m.render(n.message())))
        .withDescriptor(new ReportingDescriptorReference().withId(n.message().key()));
    n.location().ifPresent(l -> out.withLocations(new LinkedHashSet<>(List.of(location(l)))));
    return out;
  }

  private static Location location(dev.plumbline.finding.Location l) {
    return new Location().withPhysicalLocation(new PhysicalLocation()
        .withArtifactLocation(artifact(l.uri()))
        .withRegion(region(l.range())));
  }

  /**
   * A location; in a notebook, the region's lines are lines of the notebook file and its
   * columns count within the code line, and the properties {@code notebookCell} and
   * {@code notebookCellLine} say which cell and which line of it.
   */
  private static Location location(dev.plumbline.finding.Location l, ScanResult scan) {
    Location out = location(l);
    scan.cellOf(l).ifPresent(cell -> {
      PropertyBag props = new PropertyBag();
      props.setAdditionalProperty("notebookCell", cell.cell());
      props.setAdditionalProperty("notebookCellLine", cell.line());
      out.withProperties(props);
    });
    return out;
  }

  private static ArtifactLocation artifact(String uri) {
    return new ArtifactLocation().withUri(encodeUri(uri)).withUriBaseId(SRCROOT);
  }

  /** Percent-encodes characters not allowed in a relative URI reference (RFC 3986). */
  static String encodeUri(String path) {
    StringBuilder sb = new StringBuilder();
    for (byte b : path.getBytes(java.nio.charset.StandardCharsets.UTF_8)) {
      int c = b & 0xff;
      if ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9')
          || "-._~/!$&'()*+,;=:@".indexOf(c) >= 0) {
        sb.append((char) c);
      } else {
        sb.append('%').append(String.format("%02X", c));
      }
    }
    return sb.toString();
  }

  /** SARIF regions are end-exclusive in columns; ours are end-inclusive. */
  private static Region region(SourceRange r) {
    return new Region()
        .withStartLine(r.startLine())
        .withStartColumn(r.startColumn())
        .withEndLine(r.endLine())
        .withEndColumn(r.endColumn() + 1);
  }

  private static Message text(String s) {
    return new Message().withText(s);
  }
}
