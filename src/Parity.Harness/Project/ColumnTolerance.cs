namespace Parity.Harness.Project;

/// <summary>A float tolerance for the columns whose names match <see cref="Glob"/> (project file <c>tolerance.columns</c>).</summary>
public sealed record ColumnTolerance(string Glob, double? Absolute, double? Relative);
