namespace Parity.Harness.Diffing;

/// <summary>The one-line migration hints, one per finding kind and rule (spec §5).</summary>
public static class MigrationHints
{
    public const string RowCount = "the modes keep different rows: look for filters on columns with missing values and write the missing case explicitly (`x is null`, `coalesce`)";
    public const string ColumnSet = "the modes produce different columns: check writes through views (alias adds the column to the view only) and statements that failed in one mode";
    public const string ColumnOrder = "the column order differs: name the columns with `select` where later steps depend on their order";
    public const string IntToFloat = "the column has missing values: under the null marker it stays int64; `fill c with 0` or `cast c to float64` makes both modes agree";
    public const string BoolToObject = "the bool column has missing values: it is object under nan and bool with nulls under null; `fill c with false` makes both modes agree";
    public const string StringStorage = "strings are `object` under boxed and `utf8` under arrow: do not branch on type_of(c); compare values, not type labels";
    public const string MixedColumn = "the column mixes strings with other values, which only boxed storage allows: `text(x)` the values or keep them in separate columns";
    public const string OtherType = "the column type differs between modes: `cast c to TYPE` where later steps depend on it";
    public const string FloatValue = "numbers differ: if the difference is rounding, compare with `--float-tolerance`; otherwise trace the statements that computed the column";
    public const string AliasValue = "the frame was changed through a view or a chained write in one mode only: write into the named frame with `set F.c = ... where COND` instead of through a temporary";
    public const string TypeLabelValue = "type_of(c) gives the storage's label ('object' under boxed, 'utf8' under arrow): do not branch on type labels; test the values instead";
    public const string OtherValue = "values differ between modes: trace the statements that computed the column against the rules of the modes compared";
    public const string NanText = "test `x is null` before text(x): under boxed+nan text() turns a missing value into the string 'nan'";
    public const string ValueVersusMissing = "a cell is a value in one mode and missing in the other: make the missing case explicit with `x is null` or `coalesce(x, ...)`";
    public const string MarkerKind = "missing values print differently per mode (NaN, None, null, NaT): test them with `x is null`, which matches every marker, never with comparisons";
    public const string NullCondition = "rows whose condition is null are dropped: write the condition as `x is not null and ...` or use `coalesce` so every mode keeps the same rows";
    public const string MissingGroupKey = "rows with a missing group key are dropped: `fill k with ...` before `group by` to keep them";
    public const string ChainedWrite = "write into the named frame with `set F.c = ... where COND` instead of through a temporary";
    public const string ViewWrite = "a write through a view (take, skip, column) reaches its parent only under alias: write into the named frame with `set F.c = ... where COND`";
    public const string MaybeCopy = "the write went into a copy (W-MAYBE-COPY): if the parent should change, write into it by name; if not, the warning is noise";
    public const string Warning = "a warning appears in one mode only: read it, and write into named frames rather than through derived ones";
    public const string CastError = "the column has missing values, which have no int64 form under nan: `fill c with ...` or `drop missing c` before the cast";
    public const string TypeWriteError = "arrow storage keeps a column to one type: write text(x) into a string column, or `cast` the column first";
    public const string MaskError = "the string predicate gives a missing value under boxed+nan: write `x is not null and contains(x, ...)`";
    public const string MaskBoolError = "the condition column has missing values, so under boxed+nan it is object and cannot select rows: write `c is not null and c`, or `fill c with false` first";
    public const string AggTypeError = "sum of a string column only works under boxed: aggregate with count or first, or concatenate explicitly";
    public const string OtherError = "the statement fails in one mode only: fix it so it runs in every mode, then run again";
    public const string Checkpoint = "a checkpoint was reached in one mode only: see the error finding of the mode that stopped";
}
