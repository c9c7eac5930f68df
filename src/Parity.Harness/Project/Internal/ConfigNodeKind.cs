namespace Parity.Harness.Project.Internal;

internal enum ConfigNodeKind
{
    Object,
    Array,
    String,
    Number,
    Bool,
    Null,
}
