using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary><c>load NAME from 'PATH' [as csv|parquet|arrow] [with (KEY = VALUE, ...)]</c>.</summary>
public sealed record LoadStatement(Identifier Name, string Path, SourceSpan PathSpan, Identifier? Format, IReadOnlyList<LoadOption> Options, SourceSpan Span)
    : Statement(Span);
