using Parity.Engine.Frames;

namespace Parity.Script.Running.Internal;

/// <summary>A frame bound to a name, and whether a copying operation made it (for <c>W-MAYBE-COPY</c>).</summary>
internal sealed record NamedFrame(string Name, Frame Frame, bool DerivedByCopy);
