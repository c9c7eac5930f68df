namespace Parity.Harness.Golden;

/// <summary>
/// One statement record of a run (a write's aliasing set, a warning, a rows-dropped note, the error), as the
/// golden comparison matches it: by <see cref="Kind"/>, statement key and <see cref="Discriminator"/> (the
/// warning code or note kind), never by line; <see cref="Content"/> is what must be equal. <see cref="Statement"/>
/// is null for records read from a version 1 run file, which named statements by line only.
/// </summary>
public sealed record GoldenRecord(string Kind, string? Statement, int Line, string Discriminator, string Content);
