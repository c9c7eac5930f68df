using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record CastItem(Identifier Column, CastTarget Target, SourceSpan TargetSpan);
