package reckoner.splice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;

import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.concurrent.CompletableFuture;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.Tools;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.call.Recorded;
import reckoner.tool.Answer;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import reckoner.tool.ToolId;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;

final class FillerTest {
  private static final Invoker INVOKER = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(Json.newMapper())),
      Clock.systemUTC());
  private final Filler filler = new Filler(INVOKER);

  @Test
  void fill_answersEveryCall_andReportsPositions() {
    Filler.Filled f = filler.fill("A <:arith(1250/4000):>, B <:arith(1/0):>.", Markup.DEFAULT, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals("A <:arith(1250/4000) :: 0.31:>, B <:arith(1/0) :: error: domain_error: division by zero:>.", f.document());
    assertEquals(List.of(2, 26), f.calls().stream().map(Filler.Spliced::position).toList());
  }

  @Test
  void fill_onErrorDropOrKeep() {
    String doc = "x <:arith(1/0):> y <:arith(2):>";
    assertEquals("x  y <:arith(2) :: 2:>", filler.fill(doc, Markup.DEFAULT, OnError.DROP, Filler.Tags.NONE).document());
    assertEquals("x <:arith(1/0):> y <:arith(2) :: 2:>", filler.fill(doc, Markup.DEFAULT, OnError.KEEP, Filler.Tags.NONE).document());
  }

  @Test
  void fill_answeredCallsAndMalformedMarkup_stayAsWritten() {
    String doc = "<:arith(1) :: 7:> <:arith(1+1 <:arith(3):>";
    Filler.Filled f = filler.fill(doc, Markup.DEFAULT, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals(doc, f.document());
    assertEquals(1, f.malformed().size());
    assertEquals(0, f.calls().size());
  }

  @Test
  void splice_answerHoldingTheSeparator_isRefused_notPassedThrough() {
    // With "3" as separator, the answer "0.31" cannot be spliced unambiguously.
    Markup m = new Markup("<:", "3", ":>");
    Filler.Filled f = filler.fill("<:arith(1250/4000):>", m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals("unspliceable", f.calls().get(0).outcome().error().get().code().wireName());
    assertFalse(f.document().contains("0.31"));
  }

  /** Documents of random prose with calls in random places; fills parse back to the same calls and single-invoke answers. */
  @Test
  void fill_roundTrip_onGeneratedDocuments() {
    String[] words = {"the", "ledger", "of", "Vell", "harbour", "shows", "(", ")", "=", "<", ">", "%", "\n", "é", "😀", "—"};
    String[] exprs = {"1250/4000", "2^3^2", "1/0", "sqrt(2)", "17 % 5", "-(3)", "x+1", "(1+2)*3", "1e3/7", "pi"};
    Gen<String> documents = in -> {
      StringBuilder sb = new StringBuilder();
      int n = (int) in.next(Constraint.between(0, 30));
      for (int i = 0; i < n; i++) {
        if (in.next(Constraint.between(0, 3)) == 0) {
          sb.append("<:arith(").append(exprs[(int) in.next(Constraint.between(0, exprs.length - 1))]).append("):>");
        } else {
          sb.append(words[(int) in.next(Constraint.between(0, words.length - 1))]).append(' ');
        }
      }
      return sb.toString();
    };
    qt().withExamples(2_000).withFixedSeed(42L).forAll(documents).checkAssert(doc -> {
      Filler.Filled f = filler.fill(doc, Markup.DEFAULT, OnError.SPLICE_ERROR, Filler.Tags.NONE);
      List<Document.Part> back = Document.parse(f.document(), Markup.DEFAULT).parts();
      List<String> answers = new ArrayList<>();
      for (Document.Part p : back) {
        if (p.call().isPresent()) {
          assertTrue(p.answer().isPresent(), "every call answered: " + f.document());
          String single = INVOKER.invokeText(p.call().get().tool(), OptionalInt.empty(), p.call().get().input(), null, null, null).text();
          assertEquals(single, p.answer().get());
          answers.add(p.answer().get());
        }
      }
      assertEquals(f.calls().stream().map(c -> c.outcome().text()).toList(), answers);
      assertEquals(doc.split("<:", -1).length, f.document().split("<:", -1).length, "no call lost or added");
    });
  }

  /**
   * The splice rule as a property: for random markups (short strings of the characters markup is
   * made of, and long reserved-token-like ones), random answers and error texts, and random text
   * around the calls, the filled document parses part for part as the original did, each call
   * holding exactly the line its outcome gave (or left as written), and no line holds a markup string.
   */
  @Test
  void fill_randomMarkupsAndAnswers_readBackPartForPart() {
    String alphabet = "<>[]|{}:e+= x-()@1";
    Gen<String> pieces = in -> {
      int n = (int) in.next(Constraint.between(0, 6));
      StringBuilder sb = new StringBuilder();
      for (int i = 0; i < n; i++) {
        sb.append(alphabet.charAt((int) in.next(Constraint.between(0, alphabet.length() - 1))));
      }
      return sb.toString();
    };
    Gen<String> markupStrings = in -> {
      if (in.next(Constraint.between(0, 9)) == 0) {
        return "<|reserved_special_token_" + in.next(Constraint.between(0, 250)) + "|>";
      }
      String p = pieces.generate(in);
      return p.isEmpty() ? "|" : p.substring(0, Math.min(3, p.length()));
    };
    Gen<Markup> markups = in -> {
      try {
        return new Markup(markupStrings.generate(in), markupStrings.generate(in), markupStrings.generate(in));
      } catch (IllegalArgumentException e) {
        return null;
      }
    };
    Gen<List<String>> answers = in -> {
      List<String> list = new ArrayList<>();
      for (int i = 0; i < 6; i++) {
        list.add((in.next(Constraint.between(0, 3)) == 0 ? "!" : "") + pieces.generate(in));
      }
      return list;
    };
    Gen<String> documents = in -> {
      StringBuilder sb = new StringBuilder();
      int n = (int) in.next(Constraint.between(0, 12));
      for (int i = 0; i < n; i++) {
        sb.append(in.next(Constraint.between(0, 2)) == 0 ? "\u0001" + i + "\u0002" : pieces.generate(in));
      }
      return sb.toString();
    };
    qt().withExamples(5_000).withFixedSeed(7L).forAll(markups, answers, documents)
        .assuming((m, a, d) -> m != null)
        .checkAssert((m, a, template) -> {
          String doc = template.replace("\u0001", m.open() + "t(").replace("\u0002", ")" + m.close());
          Filler stand = new Filler((call, tags, position, review) -> {
            String text = a.get(Integer.parseInt(call.input().replaceAll("[^0-9]", "0")) % a.size());
            Outcome o = text.startsWith("!")
                ? new Outcome("id", Optional.of(ToolId.of("t", 1)), Optional.empty(), Optional.empty(),
                    Optional.of(ToolError.of(ErrorCode.SYNTAX_ERROR, text.substring(1))), false, 0)
                : new Outcome("id", Optional.of(ToolId.of("t", 1)), Optional.empty(), Optional.of(Answer.of(text)),
                    Optional.empty(), false, 0);
            return new Recorded(review.apply(o), CompletableFuture.completedFuture(null));
          });
          Filler.Filled f = stand.fill(doc, m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
          List<Document.Part> before = Document.parse(doc, m).parts();
          List<Document.Part> after = Document.parse(f.document(), m).parts();
          assertEquals(before.size(), after.size(), () -> "parts of " + doc + " -> " + f.document() + " with " + m);
          int call = 0;
          for (int i = 0; i < before.size(); i++) {
            Document.Part b = before.get(i);
            Document.Part x = after.get(i);
            if (!b.isUnanswered()) {
              assertEquals(b.raw(), x.raw());
              continue;
            }
            Filler.Spliced s = f.calls().get(call++);
            assertEquals(b.call(), x.call());
            assertEquals(Optional.ofNullable(s.line()), x.answer(), () -> "in " + f.document() + " with " + m);
            if (s.line() != null) {
              assertFalse(m.occursIn(s.line()), s.line());
              assertTrue(s.line().equals(s.outcome().text()) || s.line().equals("error: " + s.outcome().error().get().code()));
            }
            if (s.outcome().isOk()) {
              assertEquals(s.outcome().text(), s.line());
            }
          }
          assertEquals(f.calls().size(), call);
        });
  }

  @Test
  void fill_answerEndingInPartOfTheClosingString_isUnspliceable_andTheLineNamesNoMarkup() {
    Markup m = new Markup("[[", " | ", "]]");
    Filler stand = new Filler((call, tags, position, review) -> new Recorded(review.apply(new Outcome("id",
        Optional.of(ToolId.of("t", 1)), Optional.empty(), Optional.of(Answer.of("x]")), Optional.empty(), false, 0)),
        CompletableFuture.completedFuture(null)));
    Filler.Filled f = stand.fill("a [[t(1)]] b", m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    Filler.Spliced s = f.calls().get(0);
    assertEquals("unspliceable", s.outcome().error().get().code().wireName());
    assertEquals("error: unspliceable: the answer begins or ends with part of a markup string, so the spliced call would not "
        + "read back as this call and answer", s.line());
    assertEquals("a [[t(1) | " + s.line() + "]] b", f.document());
  }

  @Test
  void fill_errorTextHoldingAMarkupString_isShortenedToItsCode() {
    Markup m = new Markup("{", "|", "]");
    Filler.Filled f = filler.fill("x {arith(1]2)] y", m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    assertEquals(List.of(), f.calls(), "']' closes the call early: malformed");
    f = filler.fill("x {arith(2 ^ 10000000)] y", m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    Filler.Spliced s = f.calls().get(0);
    assertFalse(s.isOk());
    assertFalse(m.occursIn(s.line()), s.line());
    assertFalse(f.document().substring(2).contains("{") && f.document().indexOf('{', 3) >= 0);
  }

  @Test
  void fill_largeNumberWithMarkupInItsExponent_isRefused_withoutQuotingTheMarkup() {
    Markup m = new Markup("<<", "e+", ">>");
    Filler.Filled f = filler.fill("big: <<arith@1(10^30)>>.", m, OnError.SPLICE_ERROR, Filler.Tags.NONE);
    Filler.Spliced s = f.calls().get(0);
    assertEquals("unspliceable", s.outcome().error().get().code().wireName());
    assertEquals("big: <<arith@1(10^30)" + "e+" + s.line() + ">>.", f.document());
    assertFalse(s.line().contains("<<") || s.line().contains(">>") || s.line().contains("e+"));
  }
}
