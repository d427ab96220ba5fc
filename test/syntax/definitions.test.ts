// The lexer and the grammar pass Chevrotain's own definition checks (empty or unreachable token
// patterns; ambiguous alternatives, left recursion): the server and the command build them with
// those checks skipped to start faster (tokens.ts, grammar.ts), so they run here instead.
import { describe, expect, test } from "vitest";
import { Lexer } from "chevrotain";
import { ALL_TOKENS, LEXER_OPTIONS } from "../../server/src/syntax/tokens";
import { ArmGrammar } from "../../server/src/syntax/grammar";

describe("syntax definitions", () => {
  test("the lexer's token patterns pass the lexer's validations", () => {
    // Chevrotain throws on definition errors unless they are deferred; deferred, it lists them
    const lexer = new Lexer(ALL_TOKENS, { ...LEXER_OPTIONS, deferDefinitionErrorsHandling: true });
    expect(lexer.lexerDefinitionErrors).toEqual([]);
  });

  test("the grammar passes the parser's validations", () => {
    // performSelfAnalysis throws "Parser Definition Errors detected" when validations find any
    expect(() => new ArmGrammar(true)).not.toThrow();
  });
});
