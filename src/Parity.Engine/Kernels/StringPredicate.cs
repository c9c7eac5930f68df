namespace Parity.Engine.Kernels;

/// <summary>The string predicates of spec §3.4.</summary>
public enum StringPredicate
{
    Contains,
    StartsWith,
    EndsWith,
}
