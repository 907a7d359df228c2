package reckoner.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaLocation;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import io.swagger.v3.oas.models.OpenAPI;
import io.swagger.v3.parser.OpenAPIV3Parser;
import io.swagger.v3.parser.core.models.ParseOptions;
import io.swagger.v3.parser.core.models.SwaggerParseResult;
import java.util.List;
import org.junit.jupiter.api.Test;
import reckoner.Tools;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * The OpenAPI document against outside tools: swagger-parser (a general-purpose OpenAPI 3.1
 * parser) must read it without a single message, and every tool spec must validate against the
 * JSON Schema 2020-12 meta-schema (https://json-schema.org/draft/2020-12/schema, bundled with the
 * networknt validator).
 */
final class OpenApiTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON));

  @Test
  void openApiDocument_parsesWithoutErrorsOrWarnings() {
    ObjectNode doc = OpenApi.assemble(CATALOG, JSON, "test");
    ParseOptions options = new ParseOptions();
    options.setResolve(true);
    SwaggerParseResult result = new OpenAPIV3Parser().readContents(JSON.writeValueAsString(doc), null, options);
    assertEquals(List.of(), result.getMessages(), "parser messages");
    OpenAPI api = result.getOpenAPI();
    assertNotNull(api);
    assertEquals("3.1.0", api.getOpenapi());
    for (ToolCatalog.Entry e : CATALOG.all()) {
      String path = "/v1/tools/" + e.tool().id().name() + "/" + e.tool().id().version() + "/invoke";
      assertNotNull(api.getPaths().get(path), path);
      assertEquals(e.spec().examples().size(),
          api.getPaths().get(path).getPost().getRequestBody().getContent().get("application/json").getExamples().size());
    }
  }

  @Test
  void everyOperation_describesItsRequestAndEveryResponse() {
    ObjectNode doc = OpenApi.assemble(CATALOG, JSON, "test");
    ParseOptions options = new ParseOptions();
    options.setResolve(true);
    OpenAPI api = new OpenAPIV3Parser().readContents(JSON.writeValueAsString(doc), null, options).getOpenAPI();
    api.getPaths().forEach((path, item) -> item.readOperationsMap().forEach((method, op) -> {
      String where = method + " " + path;
      assertNotNull(op.getOperationId(), where);
      assertTrue(op.getResponses() != null && op.getResponses().containsKey("200"), where + " has a 200");
      op.getResponses().forEach((status, r) -> {
        assertTrue(r.getDescription() != null && !r.getDescription().isBlank(), where + " " + status + " described");
        assertTrue(r.getContent() != null && !r.getContent().isEmpty(), where + " " + status + " has content");
        r.getContent().forEach((type, media) -> assertNotNull(media.getSchema(), where + " " + status + " " + type));
      });
      if (method == io.swagger.v3.oas.models.PathItem.HttpMethod.POST && !path.endsWith("/reload") && !path.equals("/v1/admin/audit")) {
        assertNotNull(op.getRequestBody(), where + " has a request body");
        io.swagger.v3.oas.models.media.Schema<?> body = op.getRequestBody().getContent().get("application/json").getSchema();
        assertTrue(body.get$ref() != null || (body.getProperties() != null && !body.getProperties().isEmpty()),
            where + ": the JSON body has a real schema, not just {type: object}");
        assertTrue(op.getResponses().keySet().stream().anyMatch(k -> k.startsWith("4")), where + " lists its refusals");
      }
    }));
    for (String path : List.of("/v1/batch", "/v1/splice", "/v1/fill")) {
      String ref = api.getPaths().get(path).getPost().getRequestBody().getContent().get("application/json").getSchema().get$ref();
      String name = ref.substring(ref.lastIndexOf('/') + 1);
      assertTrue(api.getComponents().getSchemas().get(name).getRequired().size() >= 1, path + " body names its required members");
    }
  }

  @Test
  void everySpec_validatesAgainstTheDraft202012MetaSchema() {
    SchemaRegistry registry = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12);
    Schema meta = registry.getSchema(SchemaLocation.of("https://json-schema.org/draft/2020-12/schema"));
    for (ToolCatalog.Entry e : CATALOG.all()) {
      List<Error> errors = meta.validate(e.spec().document());
      assertEquals(List.of(), errors, e.tool().id().toString());
    }
  }

  @Test
  void metaSchemaCheck_canFail() {
    // The check above is only worth something if a broken schema fails it.
    SchemaRegistry registry = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12);
    Schema meta = registry.getSchema(SchemaLocation.of("https://json-schema.org/draft/2020-12/schema"));
    ObjectNode broken = JSON.createObjectNode();
    broken.put("type", "no-such-type");
    broken.put("minLength", -1);
    assertTrue(!meta.validate(broken).isEmpty());
  }

  @Test
  void everyExample_passesItsOwnSchema_unlessItExpectsInvalidArgument() {
    for (ToolCatalog.Entry e : CATALOG.all()) {
      for (ToolSpec.Example ex : e.spec().examples()) {
        boolean valid = e.validator().check(ex.args()).isEmpty();
        if (!valid) {
          assertEquals("invalid_argument", ex.error(), e.tool().id() + ": " + ex.title());
        }
      }
    }
  }
}
