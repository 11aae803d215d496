; Inno Setup 6 script: the Windows installer for the Slackline folder built by
; installer/build.py (dist\Slackline). Build on Windows with
;     python installer\build.py --package
; or by hand: iscc /DAppVersion=0.1.0 installer\windows\slackline.iss
; It installs per user by default (no administrator rights; the wizard offers all users),
; adds a Start-menu entry, optionally a desktop shortcut, and opens .slw plan files in
; Slackline. Uninstalling removes the files, the shortcuts and the file association.

#ifndef AppVersion
  #define AppVersion "0.1.0"
#endif
#ifndef AppFolder
  #define AppFolder "..\..\dist\Slackline"
#endif
#define AppExe "slackline-gui.exe"
#define ProgId "Slackline.Workbook"

[Setup]
AppId={{E4E29DE4-045F-4814-9220-46D8B7921EF8}
AppName=Slackline
AppVersion={#AppVersion}
AppVerName=Slackline {#AppVersion}
AppPublisher=The Slackline developers
DefaultDirName={autopf}\Slackline
DefaultGroupName=Slackline
DisableProgramGroupPage=yes
PrivilegesRequired=lowest
PrivilegesRequiredOverridesAllowed=dialog
ChangesAssociations=yes
ArchitecturesAllowed=x64compatible
ArchitecturesInstallIn64BitMode=x64compatible
OutputDir=..\..\dist
OutputBaseFilename=Slackline-{#AppVersion}-setup
SetupIconFile=..\..\resources\icon\slackline.ico
UninstallDisplayIcon={app}\{#AppExe}
UninstallDisplayName=Slackline
Compression=lzma2
SolidCompression=yes
WizardStyle=modern

[Tasks]
Name: "associate"; Description: "Open .slw plan files with Slackline"; GroupDescription: "File types:"
Name: "desktopicon"; Description: "{cm:CreateDesktopIcon}"; GroupDescription: "{cm:AdditionalIcons}"; Flags: unchecked

[Files]
Source: "{#AppFolder}\*"; DestDir: "{app}"; Flags: ignoreversion recursesubdirs createallsubdirs

[Icons]
Name: "{group}\Slackline"; Filename: "{app}\{#AppExe}"; Comment: "Critical path and the odds of finishing on time"
Name: "{autodesktop}\Slackline"; Filename: "{app}\{#AppExe}"; Tasks: desktopicon

[Registry]
; The .slw file type: extension -> ProgID -> icon and "open" command (HKA = per user or
; all users, following the install mode).
Root: HKA; Subkey: "Software\Classes\.slw"; ValueType: string; ValueName: ""; ValueData: "{#ProgId}"; Flags: uninsdeletevalue; Tasks: associate
Root: HKA; Subkey: "Software\Classes\.slw"; ValueType: string; ValueName: "Content Type"; ValueData: "application/x-slackline-workbook"; Flags: uninsdeletevalue; Tasks: associate
Root: HKA; Subkey: "Software\Classes\.slw\OpenWithProgids"; ValueType: string; ValueName: "{#ProgId}"; ValueData: ""; Flags: uninsdeletevalue; Tasks: associate
Root: HKA; Subkey: "Software\Classes\{#ProgId}"; ValueType: string; ValueName: ""; ValueData: "Slackline plan"; Flags: uninsdeletekey; Tasks: associate
Root: HKA; Subkey: "Software\Classes\{#ProgId}\DefaultIcon"; ValueType: string; ValueName: ""; ValueData: "{app}\{#AppExe},0"; Tasks: associate
Root: HKA; Subkey: "Software\Classes\{#ProgId}\shell\open\command"; ValueType: string; ValueName: ""; ValueData: """{app}\{#AppExe}"" ""%1"""; Tasks: associate
Root: HKA; Subkey: "Software\Classes\Applications\{#AppExe}\SupportedTypes"; ValueType: string; ValueName: ".slw"; ValueData: ""; Flags: uninsdeletekey

[Run]
Filename: "{app}\{#AppExe}"; Description: "{cm:LaunchProgram,Slackline}"; Flags: nowait postinstall skipifsilent
