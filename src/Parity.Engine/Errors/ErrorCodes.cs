namespace Parity.Engine.Errors;

/// <summary>
/// The stable error and warning codes. Codes named by the spec keep its spelling; the rest are ours and are
/// documented in docs/language.md ("Error codes").
/// </summary>
public static class ErrorCodes
{
    // Spec §2.2, §2.3, §3.5
    public const string MaskMissing = "E-MASK-MISSING";
    public const string TypeWrite = "E-TYPE-WRITE";
    public const string AggType = "E-AGG-TYPE";
    public const string Cast = "E-CAST";
    public const string Overflow = "E-OVERFLOW";
    public const string Type = "E-TYPE";
    public const string DupCheckpoint = "E-DUP-CHECKPOINT";
    public const string UnknownColumn = "E-UNKNOWN-COLUMN";
    public const string UnknownFrame = "E-UNKNOWN-FRAME";
    public const string Syntax = "E-SYNTAX";

    // Script checks
    public const string UnknownFunction = "E-UNKNOWN-FUNCTION";
    public const string ArgCount = "E-ARG-COUNT";
    public const string AggregatePlace = "E-AGG-PLACE";
    public const string DupColumn = "E-DUP-COLUMN";
    public const string BadOption = "E-OPTION";
    public const string Limit = "E-LIMIT";
    public const string PathOutsideRoot = "E-PATH";

    // Data loading
    public const string FileNotFound = "E-FILE-NOT-FOUND";
    public const string FileRead = "E-FILE-READ";
    public const string FileWrite = "E-FILE-WRITE";
    public const string FileFormat = "E-FILE-FORMAT";
    public const string CsvQuote = "E-CSV-QUOTE";
    public const string CsvRagged = "E-CSV-RAGGED";
    public const string CsvHeader = "E-CSV-HEADER";
    public const string Utf8 = "E-UTF8";
    public const string Parquet = "E-PARQUET";
    public const string ArrowIpc = "E-ARROW";

    // Harness
    public const string Usage = "E-USAGE";
    public const string Config = "E-CONFIG";
    public const string Golden = "E-GOLDEN";
    public const string GoldenLock = "E-GOLDEN-LOCK";
    public const string Internal = "E-INTERNAL";
    public const string NoSuchFinding = "E-NO-FINDING";

    // Warnings (spec §2.2)
    public const string MaybeCopy = "W-MAYBE-COPY";
    public const string ChainedWrite = "W-CHAINED-WRITE";
}
