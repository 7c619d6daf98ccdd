// The anode list's words live in lib/labels (one vocabulary); this path stays for the PDF renderer's imports.
export * from '@/lib/labels/anode-list';
