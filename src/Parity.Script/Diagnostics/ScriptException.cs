namespace Parity.Script.Diagnostics;

/// <summary>A run-time error at a script position; the interpreter stops the mode there.</summary>
public sealed class ScriptException : Exception
{
    public ScriptException(Diagnostic diagnostic)
        : base(diagnostic.Message)
    {
        Diagnostic = diagnostic;
    }

    public ScriptException()
        : this(new Diagnostic("E-INTERNAL", "internal error", "", default))
    {
    }

    public ScriptException(string message)
        : this(new Diagnostic("E-INTERNAL", message, "", default))
    {
    }

    public ScriptException(string message, Exception inner)
        : base(message, inner)
    {
        Diagnostic = new Diagnostic("E-INTERNAL", message, "", default);
    }

    public Diagnostic Diagnostic { get; }
}
