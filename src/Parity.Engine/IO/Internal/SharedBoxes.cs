namespace Parity.Engine.IO.Internal;

/// <summary>
/// One boxed object per constant, shared by every cell that holds it, as legacy stacks share their boolean
/// and NaN singletons; memory accounting counts a shared object once.
/// </summary>
internal static class SharedBoxes
{
    public static readonly object True = true;
    public static readonly object False = false;
    public static readonly object NaN = double.NaN;
}
