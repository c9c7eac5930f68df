using Parity.Engine.Frames;
using Parity.Engine.Modes;

namespace Parity.Engine.IO;

/// <summary>Loads CSV, Parquet and Arrow IPC files into a table for one mode. PENDING: the foundation issue replaces this body.</summary>
public static class DataLoader
{
    /// <summary>
    /// Loads <paramref name="path"/> with the types and missing markers of <paramref name="mode"/> (spec §2.1, §6).
    /// Bad input throws <see cref="Errors.EngineException"/> with file, row and column where known.
    /// </summary>
    public static Table Load(string path, LoadOptions options, Mode mode) => throw new NotImplementedException("pending: loaders");
}
