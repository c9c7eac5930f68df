using Parity.Engine.Errors;
using Parity.Engine.Files;
using Parity.Engine.Frames;
using Parity.Engine.IO.Internal;
using Parity.Engine.Modes;

namespace Parity.Engine.IO;

/// <summary>
/// Loads CSV, Parquet and Arrow IPC files into a table for one mode (spec §2.1, §6). A file is parsed once
/// into a mode-neutral form (typed buffers plus validity) that a small cache keeps, keyed by full path,
/// options, size and last write time, so loading it for several modes converts without re-parsing
/// (<see cref="LoadOptions.KeepParsed"/> false for the last of them).
/// </summary>
public static class DataLoader
{
    private const int CacheSize = 4;
    private static readonly Lock Gate = new();
    private static readonly LinkedList<(string Key, SourceTable Source)> Cache = new();

    /// <summary>
    /// Loads <paramref name="path"/> with the types and missing markers of <paramref name="mode"/> (spec §2.1, §6).
    /// Bad input throws <see cref="EngineException"/> with file, row and column where known.
    /// </summary>
    public static Table Load(string path, LoadOptions options, Mode mode) => ReadSource(path, options).ToTable(mode);

    /// <summary>The format a path is read as: <c>csv</c>, <c>parquet</c> or <c>arrow</c>; null when neither option nor extension says.</summary>
    public static string? FormatOf(string path, LoadOptions options)
    {
        if (options.Format is { } f)
        {
            var lower = f.ToLowerInvariant();
            return lower switch
            {
                "csv" => "csv",
                "parquet" => "parquet",
                "arrow" or "ipc" or "feather" or "arrows" => "arrow",
                _ => null,
            };
        }
        return Path.GetExtension(path).ToLowerInvariant() switch
        {
            ".csv" => "csv",
            ".parquet" => "parquet",
            ".arrow" or ".arrows" or ".ipc" or ".feather" => "arrow",
            _ => null,
        };
    }

    /// <summary>Drops every cached parse (tests and benchmarks that measure a cold load).</summary>
    public static void ClearCache()
    {
        lock (Gate) Cache.Clear();
    }

    internal static SourceTable ReadSource(string path, LoadOptions options)
    {
        var display = options.DisplayPath ?? path;
        var format = FormatOf(path, options)
            ?? throw LoadThrow.Format(display, options.Format is null
                ? "unknown file extension: expected .csv, .parquet, .arrow, .arrows, .ipc or .feather (or say: as csv)"
                : $"unknown format '{options.Format}': expected csv, parquet or arrow");
        using var opened = SafeFile.OpenRead(path, new FileReadRules
        {
            Display = display,
            Root = options.Root,
            OutsideHint = "pass --root DIR to widen the root or --allow-outside-root to allow it",
        });
        var full = opened.RealPath;
        DateTime written;
        try
        {
            written = File.GetLastWriteTimeUtc(opened.Handle);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw LoadThrow.FileRead(display, ex.Message);
        }
        var key = string.Join('\u001f', full, format, options.Delimiter.ToString(),
            options.MissingTokens is null ? "\u0000" : string.Join('\u001e', options.MissingTokens),
            opened.Length.ToString(System.Globalization.CultureInfo.InvariantCulture),
            written.Ticks.ToString(System.Globalization.CultureInfo.InvariantCulture));
        var keep = options.KeepParsed || opened.Length < options.AlwaysKeepBelowBytes;
        lock (Gate)
        {
            for (var node = Cache.First; node is not null; node = node.Next)
            {
                if (!string.Equals(node.Value.Key, key, StringComparison.Ordinal)) continue;
                Cache.Remove(node);
                if (keep) Cache.AddFirst(node);
                return node.Value.Source;
            }
        }
        // The readers reopen the very file the checked handle holds, never the path again.
        var source = format switch
        {
            "csv" => CsvSourceReader.Read(opened.ReopenPath, display, options),
            "parquet" => ParquetSourceReader.Read(opened.ReopenPath, display),
            _ => ArrowSourceReader.Read(opened.ReopenPath, opened.Length, display),
        };
        if (!keep) return source;
        lock (Gate)
        {
            Cache.AddFirst((key, source));
            while (Cache.Count > CacheSize) Cache.RemoveLast();
        }
        return source;
    }
}
