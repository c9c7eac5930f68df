namespace Parity;

/// <summary>
/// Bad input: a script or data file that cannot be read or parsed, an error in every mode, an unknown mode
/// or a missing frame. The message holds each located problem on its own line
/// (<c>file:line:col: error CODE: message</c>), as the <c>parity</c> command prints them.
/// </summary>
public sealed class ParityInputException : Exception
{
    /// <summary>A bad-input exception with the given located problems.</summary>
    public ParityInputException(IReadOnlyList<string> problems)
        : base(string.Join("\n", problems))
    {
        Problems = problems;
    }

    /// <summary>A bad-input exception with one problem.</summary>
    public ParityInputException(string message)
        : this([message])
    {
    }

    /// <summary>A bad-input exception with one problem and the exception behind it.</summary>
    public ParityInputException(string message, Exception inner)
        : base(message, inner)
    {
        Problems = [message];
    }

    /// <summary>A bad-input exception without details.</summary>
    public ParityInputException()
        : this("bad input")
    {
    }

    /// <summary>The located problems, one line each.</summary>
    public IReadOnlyList<string> Problems { get; }
}
