namespace Parity.Engine.Kernels;

/// <summary>The comparison operators of spec §3.4 (<c>!=</c> is <see cref="NotEqual"/>).</summary>
public enum ComparisonOp
{
    Equal,
    NotEqual,
    Less,
    LessOrEqual,
    Greater,
    GreaterOrEqual,
}
